import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { MIGRATIONS } from '../../migrations/index';

describe('migrations/index.ts', () => {
  it('lists every migration file in the folder, in name order', () => {
    const files = readdirSync(new URL('../../migrations/', import.meta.url))
      .filter((f) => f.endsWith('.ts') && f !== 'index.ts')
      .map((f) => f.replace(/\.ts$/, ''))
      .sort();
    expect(Object.keys(MIGRATIONS)).toEqual(files);
  });
});
