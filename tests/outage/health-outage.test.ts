// Stops the test cluster for real, so it runs alone after every other suite (scripts/test.ts).
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { useHarness } from '../api/support/harness';

const h = useHarness();
const dataDir = process.env.PG_DATA_DIR!;
const port = process.env.PGPORT!;

function pgCtl(args: string[]) {
  const pgCtlBin = spawnSync('sh', ['-c', 'ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1'], { encoding: 'utf8' }).stdout.trim() + '/pg_ctl';
  const asRoot = process.getuid?.() === 0;
  const cmd = asRoot ? 'runuser' : pgCtlBin;
  const full = asRoot ? ['-u', 'postgres', '--', pgCtlBin, ...args] : args;
  const r = spawnSync(cmd, full, { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`pg_ctl ${args.join(' ')}: ${r.stderr}`);
}

describe('health across a database outage', () => {
  it('answers ok, then 503 with db "down" while PostgreSQL is stopped, then ok again once it is back', async () => {
    expect((await request(h.app).get('/api/health')).body).toEqual({ status: 'ok', db: 'up' });
    pgCtl(['-D', dataDir, '-m', 'fast', '-w', 'stop']);
    try {
      const down = await request(h.app).get('/api/health');
      expect(down.status).toBe(503);
      expect(down.body).toEqual({ status: 'degraded', db: 'down' });
      // Other routes fail cleanly too, never with a hang.
      const login = await request(h.app).post('/api/auth/login').send({ email: 'admin@demo.test', password: 'packwright-demo' });
      expect(login.status).toBe(503);
    } finally {
      pgCtl(['-D', dataDir, '-l', `${dataDir}/server.log`, '-w', '-o', `-c listen_addresses=127.0.0.1 -p ${port} -c unix_socket_directories=''`, 'start']);
    }
    let up = await request(h.app).get('/api/health');
    for (let i = 0; i < 20 && up.status !== 200; i++) {
      await new Promise((r) => setTimeout(r, 250));
      up = await request(h.app).get('/api/health');
    }
    expect(up.status).toBe(200);
    expect(up.body).toEqual({ status: 'ok', db: 'up' });
  });
});
