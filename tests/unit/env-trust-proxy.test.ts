import express from 'express';
import { describe, expect, it } from 'vitest';
import { loadEnv, trustProxySetting } from '../../server/config/env';

describe('TRUST_PROXY', () => {
  it('trusts no proxy when unset, and takes a hop count or a list of addresses and subnets', () => {
    expect(trustProxySetting(loadEnv({}).TRUST_PROXY)).toBe(false);
    expect(trustProxySetting(loadEnv({ TRUST_PROXY: '0' }).TRUST_PROXY)).toBe(false);
    expect(trustProxySetting(loadEnv({ TRUST_PROXY: '1' }).TRUST_PROXY)).toBe(1);
    expect(trustProxySetting(loadEnv({ TRUST_PROXY: 'loopback, 10.0.0.0/8' }).TRUST_PROXY)).toBe('loopback, 10.0.0.0/8');
    // Express accepts what the setting passes on (it throws on an address it cannot read).
    const app = express();
    expect(() => app.set('trust proxy', trustProxySetting('loopback, 10.0.0.0/8, fd00::/8'))).not.toThrow();
  });

  it('refuses a blanket "true" and text that is not addresses, naming the variable', () => {
    expect(() => loadEnv({ TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY=true would let any client forge/);
    expect(() => loadEnv({ TRUST_PROXY: 'proxy one; proxy two' })).toThrow(/TRUST_PROXY must be a hop count/);
  });
});
