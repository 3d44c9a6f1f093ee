import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
// The library behind npm start and npm test.
import { freePort, instance } from '../../api/scripts/lib/mariadb.mjs';

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
