import { DiscoveryService, MetadataScanner, Reflector } from '@nestjs/core';
import { IS_PUBLIC, Roles } from '../src/common/roles.decorator';
import { startTestApp, type TestApp } from './support/test-app';

describe('every route states who may call it', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('has @Roles or @Public on each handler (default deny otherwise)', () => {
    const discovery = t.app.get(DiscoveryService);
    const scanner = t.app.get(MetadataScanner);
    const reflector = t.app.get(Reflector);
    const missing: string[] = [];
    let handlers = 0;
    for (const wrapper of discovery.getControllers()) {
      const instance = wrapper.instance as object;
      const proto = Object.getPrototypeOf(instance);
      for (const name of scanner.getAllMethodNames(proto)) {
        const handler = proto[name];
        if (!Reflect.getMetadata('path', handler) && Reflect.getMetadata('path', handler) !== '') continue;
        handlers++;
        const roles = reflector.getAllAndOverride(Roles, [handler, wrapper.metatype as never]);
        const isPublic = reflector.getAllAndOverride(IS_PUBLIC, [handler, wrapper.metatype as never]);
        if (!roles && !isPublic) missing.push(`${wrapper.name}.${name}`);
      }
    }
    expect(handlers).toBeGreaterThan(10);
    expect(missing).toEqual([]);
  });

  it('publishes an OpenAPI document listing the routes', async () => {
    const res = await t.app.inject({ method: 'GET', url: '/api/docs-json' });
    expect(res.statusCode).toBe(200);
    const doc = res.json();
    expect(Object.keys(doc.paths)).toEqual(expect.arrayContaining(['/api/auth/sign-in', '/api/auth/sign-out', '/api/me', '/api/users']));
    expect(doc.paths['/api/auth/sign-in'].post.requestBody.content['application/json'].schema.properties).toHaveProperty('email');
    const ui = await t.app.inject({ method: 'GET', url: '/api/docs' });
    expect(ui.statusCode).toBe(200);
  });
});
