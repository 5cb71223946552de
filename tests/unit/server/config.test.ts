import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../../server/config/env';

describe('loadConfig', () => {
  it('when nothing is set, then the documented defaults apply and demo data goes on the embedded database', () => {
    const config = loadConfig({});
    expect(config.PORT).toBe(4310);
    expect(config.HOST).toBe('127.0.0.1');
    expect(config.HALFLIGHT_PG_PORT).toBe(55432);
    expect(config.DATABASE_URL).toBeUndefined();
    expect(config.demoData).toBe(true);
  });

  it('when DATABASE_URL points elsewhere, then demo data is off unless asked for', () => {
    expect(loadConfig({ DATABASE_URL: 'postgres://u:p@db.example:5432/x' }).demoData).toBe(false);
    expect(loadConfig({ DATABASE_URL: 'postgres://u:p@db.example:5432/x', HALFLIGHT_DEMO_DATA: 'true' }).demoData).toBe(
      true,
    );
  });

  it('when variables are malformed, then one error names each of them', () => {
    expect(() => loadConfig({ PORT: 'eighty', DATABASE_URL: 'mysql://x', SESSION_SECRET: 'short' })).toThrowError(
      /PORT[\s\S]*DATABASE_URL: must be a postgres:\/\/[\s\S]*SESSION_SECRET: must be at least 32/,
    );
  });
});
