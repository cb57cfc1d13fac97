/**
 * Writes shared/physics/md/mie-kernels.generated.ts: the Mie λr-6 pair loops for integer λr, one per λr with its own
 * power chain (shared/physics/md/mie-kernel-source.ts; mie-kernels.test.ts checks that the file is up to date).
 *
 *   node --import tsx scripts/generate-mie-kernels.ts
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { mieKernelSource } from '../shared/physics/md/mie-kernel-source';

const target = fileURLToPath(new URL('../shared/physics/md/mie-kernels.generated.ts', import.meta.url));
writeFileSync(target, mieKernelSource());
process.stderr.write(`wrote ${target}\n`);
