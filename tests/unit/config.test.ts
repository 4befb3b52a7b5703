import { describe, expect, test } from 'vitest';
import { ConfigError, parseConfig } from '../../server/src/config/env';

const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db', SESSION_SECRET: 'x'.repeat(32) };

describe('configuration from the environment', () => {
  test('when only the required settings are given, then the embedded defaults fill the rest', () => {
    const config = parseConfig(base);
    expect(config.PORT).toBe(3000);
    expect(config.publicUrl).toBe('http://localhost:3000');
    expect(config.useMailCatcher).toBe(true);
    expect(config.secureCookies).toBe(false);
  });
  test('when PUBLIC_URL is https, then cookies are Secure', () => {
    expect(parseConfig({ ...base, PUBLIC_URL: 'https://sporewell.example.test/' }).secureCookies).toBe(true);
  });
  test('when settings are wrong, then start-up fails naming each variable', () => {
    try {
      parseConfig({ DATABASE_URL: 'mysql://nope', SESSION_SECRET: 'short', PORT: 'eighty' });
      expect.unreachable('parseConfig should have thrown');
    } catch (error) {
      expect(error).toBeInstanceOf(ConfigError);
      const message = (error as Error).message;
      expect(message).toMatch(/DATABASE_URL/);
      expect(message).toMatch(/SESSION_SECRET/);
      expect(message).toMatch(/PORT/);
    }
  });
  test('when production runs without PUBLIC_URL or SMTP_URL, then it refuses to start', () => {
    expect(() => parseConfig({ ...base, NODE_ENV: 'production' })).toThrow(/PUBLIC_URL[\s\S]*SMTP_URL/);
  });
  test('when SMTP_URL is set, then no mail catcher is used', () => {
    expect(parseConfig({ ...base, SMTP_URL: 'smtp://127.0.0.1:2525' }).useMailCatcher).toBe(false);
  });
});
