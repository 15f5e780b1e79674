import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';

describe('configuration from the environment', () => {
  it('has working local defaults that listen on loopback only', () => {
    const c = loadConfig({});
    expect(c.host).toBe('127.0.0.1');
    expect(c.port).toBe(8329);
    expect(c.databaseUrl).toMatch(/127\.0\.0\.1/);
  });
  it('refuses a session secret shorter than 32 bytes (HS256, RFC 7518 §3.2)', () => {
    expect(() => loadConfig({ SESSION_SECRET: 'short' })).toThrow(/at least 32 bytes/);
  });
  it('names the variable that is wrong', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT/);
  });
});
