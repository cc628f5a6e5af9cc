// Issue 7 as part of the README's test command: the large world (10,000 drummers, 2,000 rooms, 50,000 briefs
// and messages, seeded once into a fixed temp folder and reused), then 100 connections of mixed traffic for
// 30 s against the real server in its own process. bench/load.ts does the work; `npm run bench` shows the
// same figures in its table.
import { describe, expect, it } from 'vitest';
import { countLoadWorld, formatLoadReport, LOAD_WORLD, loadWorldDir, runLoadBench } from '../../bench/load';

describe('load: mixed traffic over the large world', () => {
  it('answers 100 connections of search, profiles, thread polling and sign-in for 30 s without one error, timeout or non-2xx', async () => {
    const dataDir = loadWorldDir();
    const result = await runLoadBench({ dataDir, connections: 100 });
    console.log(`load world in ${dataDir}: ${JSON.stringify(countLoadWorld(dataDir))}\n${formatLoadReport(result)}`);

    expect(countLoadWorld(dataDir)).toEqual({
      drummers: LOAD_WORLD.drummers,
      rooms: LOAD_WORLD.rooms,
      briefs: LOAD_WORLD.briefs,
      messages: LOAD_WORLD.threads * LOAD_WORLD.messagesPerThread,
    });
    expect(result.durationSec).toBe(30);
    // Every route of the mix was answered, so a zero below is not a route that never ran.
    expect(Object.keys(result.routes).sort()).toEqual(['GET /api/drummers', 'GET /api/drummers/:id', 'GET /api/threads/:id/messages', 'POST /api/auth/login']);
    expect(Object.values(result.routes).every((route) => route.requests > 0)).toBe(true);
    expect({ errors: result.errors, timeouts: result.timeouts, rateLimited: result.rateLimited, otherNon2xx: result.otherNon2xx, nonOk: result.nonOk }).toEqual({
      errors: 0,
      timeouts: 0,
      rateLimited: 0,
      otherNon2xx: 0,
      nonOk: {},
    });
    expect(result.statusCounts).toEqual({ '200': result.requests });
  });
});
