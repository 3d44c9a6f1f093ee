import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
// The library behind npm start and npm test.
import { chooseDatabasePort, freePort, instance } from '../../api/scripts/lib/mariadb.mjs';

describe('the private MariaDB of npm start', () => {
  const dir = mkdtempSync(join(tmpdir(), 'crumbproof-db-check-'));
  let db: ReturnType<typeof instance>;
  afterAll(async () => {
    await db?.stop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('starts on a free port bound to 127.0.0.1, creates the database, and stops again', async () => {
    const port = await freePort();
    db = instance({ dir, port });
    await db.start();
    expect(db.ping()).toBe(true);
    db.createDatabase({ database: 'crumbproof_check', user: 'crumbproof', password: 'crumbproof-local' });
    const tcp = spawnSync(
      'mariadb',
      [
        '--no-defaults',
        '-h',
        '127.0.0.1',
        '-P',
        String(port),
        '-u',
        'crumbproof',
        '-pcrumbproof-local',
        '-N',
        '-e',
        'SELECT @@bind_address, @@character_set_server, DATABASE() FROM DUAL',
        'crumbproof_check',
      ],
      { encoding: 'utf8' },
    );
    expect(tcp.status).toBe(0);
    expect(tcp.stdout.trim().split('\t')).toEqual(['127.0.0.1', 'utf8mb4', 'crumbproof_check']);
    const pid = db.runningPid();
    expect(pid).toBeGreaterThan(0);

    await expect(instance({ dir, port }).start()).rejects.toThrow(/already runs/);

    await db.stop();
    expect(db.runningPid()).toBeNull();
    expect(() => process.kill(pid!, 0)).toThrow();
  });

  it('keeps its data across a restart', async () => {
    await db.start();
    const r = spawnSync('mariadb', [`--defaults-file=${db.cnf}`, '-N', '-e', 'SHOW DATABASES LIKE "crumbproof_check"'], {
      encoding: 'utf8',
    });
    expect(r.stdout.trim()).toBe('crumbproof_check');
    await db.stop();
  });

  it('says clearly that another npm start already runs from the same folder', () => {
    const other = spawn('sleep', ['30']);
    try {
      writeFileSync(join(dir, 'owner.lock'), `${other.pid}\nnpm start\n`);
      expect(() => instance({ dir, port: 1 }).claim('npm start')).toThrow(/already running from this folder/);
    } finally {
      other.kill();
    }
  });

  it('refuses a port that is already taken, naming it', async () => {
    const busy = await freePort();
    const { createServer } = await import('node:net');
    const srv = createServer().listen(busy, '127.0.0.1');
    await new Promise((r) => srv.once('listening', r));
    try {
      const other = instance({ dir: mkdtempSync(join(tmpdir(), 'crumbproof-db-busy-')), port: busy });
      await expect(other.start()).rejects.toThrow(new RegExp(`Port ${busy}`));
    } finally {
      srv.close();
    }
  });
});

describe('the database port of a second copy on the same machine', () => {
  const dir = mkdtempSync(join(tmpdir(), 'crumbproof-port-check-'));
  const saved = process.env.DB_PORT;
  afterAll(() => {
    if (saved === undefined) delete process.env.DB_PORT;
    else process.env.DB_PORT = saved;
    rmSync(dir, { recursive: true, force: true });
  });

  it('keeps a free remembered port, and moves to a free one (remembered) when another program holds it', async () => {
    delete process.env.DB_PORT;
    const taken = await freePort();
    writeFileSync(join(dir, 'port'), `${taken}\n`);
    expect(await chooseDatabasePort(dir, () => {})).toBe(taken);

    const holder = createServer().listen(taken, '127.0.0.1');
    await new Promise((r) => holder.once('listening', r));
    const said: string[] = [];
    try {
      const moved = await chooseDatabasePort(dir, (m) => said.push(m));
      expect(moved).not.toBe(taken);
      expect(readFileSync(join(dir, 'port'), 'utf8').trim()).toBe(String(moved));
      expect(said.join(' ')).toContain(`Port ${taken} on 127.0.0.1 is taken`);
      // The next start finds the same address again.
      expect(await chooseDatabasePort(dir, () => {})).toBe(moved);
    } finally {
      await new Promise((r) => holder.close(r));
    }
  });

  it('uses DB_PORT as given', async () => {
    process.env.DB_PORT = '3999';
    expect(await chooseDatabasePort(dir, () => {})).toBe(3999);
  });
});
