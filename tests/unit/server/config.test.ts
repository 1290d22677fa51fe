import { ConfigError, loadConfig } from '@/server/config';

const base = { DATABASE_URL: 'postgres://k:p@127.0.0.1:5432/kenning' };

describe('loadConfig', () => {
  it('applies the documented defaults', () => {
    const cfg = loadConfig({ ...base, SESSION_SECRET: 'x'.repeat(32) });
    expect(cfg).toMatchObject({ HOST: '127.0.0.1', PORT: 8080, NODE_ENV: 'development', TRUST_PROXY: false });
  });

  it('names each invalid variable', () => {
    expect(() => loadConfig({ DATABASE_URL: 'mysql://x', PORT: 'eighty', SESSION_SECRET: 'x'.repeat(32) })).toThrow(ConfigError);
    try {
      loadConfig({ DATABASE_URL: 'mysql://x', PORT: 'eighty', SESSION_SECRET: 'x'.repeat(32) });
    } catch (e) {
      expect(String(e)).toMatch(/DATABASE_URL/);
      expect(String(e)).toMatch(/PORT/);
    }
  });

  it('refuses a short session secret', () => {
    expect(() => loadConfig({ ...base, SESSION_SECRET: 'short' })).toThrow(/SESSION_SECRET/);
  });

  it('requires a session secret in production', () => {
    expect(() => loadConfig({ ...base, NODE_ENV: 'production' })).toThrow(/SESSION_SECRET must be set/);
  });

  it('builds mail links from PUBLIC_URL: required in production, http://HOST:PORT elsewhere, no trailing slash', () => {
    const prod = { ...base, NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(32) };
    expect(() => loadConfig(prod)).toThrow(/PUBLIC_URL must be set/);
    expect(loadConfig({ ...prod, PUBLIC_URL: 'https://kenning.example.org/' }).PUBLIC_URL).toBe('https://kenning.example.org');
    expect(loadConfig({ ...base, SESSION_SECRET: 'x'.repeat(32), PORT: '9000' }).PUBLIC_URL).toBe('http://127.0.0.1:9000');
    expect(() => loadConfig({ ...base, SESSION_SECRET: 'x'.repeat(32), PUBLIC_URL: 'ftp://x' })).toThrow(/PUBLIC_URL/);
  });

  it('does not mutate the environment object it is given', () => {
    const env = { ...base, SESSION_SECRET: 'y'.repeat(40), PORT: '9000' };
    const copy = { ...env };
    expect(loadConfig(env).PORT).toBe(9000);
    expect(env).toEqual(copy);
  });
});
