import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { DEMO_MIXTURES, DEMO_PEOPLE, DEMO_SUBSTANCES, demoFileOf, demoHasTable, type DemoKind } from '../../fixtures/demo/scenario';
import { hashPassword } from '../features/auth/auth';
import { recordAudit } from '../features/audit/audit.service';
import { parseUpload, storeVersion } from '../features/measurement-sets/measurement-sets.service';
import { countPeople, findPersonByEmail, insertPerson, rolesOf } from '../features/people/people.repository';
import type { Db } from './database';

const demoFile = (name: string) => readFileSync(new URL(`../../fixtures/demo/${name}`, import.meta.url));

/**
 * Seeds the invented demo scenario into an empty database: one person per role, then the demo
 * substances with their measurement tables, uploaded through the same parser and store as any upload.
 * Does nothing when any person exists, so it is safe to call at every start.
 */
export async function seedDemo(db: Db, options: { demoPassword: string }): Promise<{ seeded: boolean }> {
  if ((await countPeople(db)) > 0) return { seeded: false };
  const passwordHash = await hashPassword(options.demoPassword);
  await db.transaction().execute(async (tx) => {
    for (const person of DEMO_PEOPLE) {
      const id = randomUUID();
      await insertPerson(tx, { id, email: person.email, name: person.name, passwordHash, roles: person.roles });
      await recordAudit(tx, { actor: null, action: 'user.created', targetType: 'user', targetId: id, summary: `Demo seed added ${person.email} with roles ${person.roles.join(', ')}`, after: { email: person.email, name: person.name, roles: person.roles } });
    }
    const modellerRow = (await findPersonByEmail(tx, 'modeller@demo.epsigma.test'))!;
    const modeller = { id: modellerRow.id, email: modellerRow.email, name: modellerRow.name, roles: await rolesOf(tx, modellerRow.id) };
    const now = new Date().toISOString();
    for (const s of DEMO_SUBSTANCES) {
      const substance = await tx
        .insertInto('substance')
        .values({ name: s.name, formula: s.formula ?? null, description: s.description, molarMassGramsPerMol: s.molarMassGPerMol, createdBy: modeller.id, createdAt: now, updatedAt: now })
        .returning('id')
        .executeTakeFirstOrThrow();
      await recordAudit(tx, { actor: modeller, action: 'substance.created', targetType: 'substance', targetId: substance.id, summary: `Demo seed created substance ${s.name}` });
      for (const kind of ['b2', 'viscosity', 'density', 'saturatedLiquidDensity', 'saturatedVapourDensity', 'vapourPressure'] as DemoKind[]) {
        const meta = s.sources[kind];
        if (!meta || !demoHasTable(s, kind)) continue;
        const name = demoFileOf(s.file, kind);
        const file = { originalname: name, buffer: demoFile(name) };
        const fields = { source: meta.source, method: meta.method };
        const parsed = parseUpload(file, kind, fields, s.molarMassGPerMol);
        await storeVersion(tx, { newMeasurementSet: { substanceId: substance.id, kind, name: meta.name }, file, fields, parsed, actor: modeller });
      }
    }
    // Cross second virial coefficients of a demo pair, stored with the pair's first substance.
    for (const m of DEMO_MIXTURES) {
      const first = await tx.selectFrom('substance').select(['id', 'molarMassGramsPerMol']).where('name', '=', m.substances[0]).executeTakeFirstOrThrow();
      const file = { originalname: `${m.file}.csv`, buffer: demoFile(`${m.file}.csv`) };
      const fields = { source: m.source, method: m.method, notes: `Cross second virial coefficient of the pair ${m.substances.join(' + ')}.` };
      const parsed = parseUpload(file, 'b12', fields, first.molarMassGramsPerMol);
      await storeVersion(tx, { newMeasurementSet: { substanceId: first.id, kind: 'b12', name: m.name }, file, fields, parsed, actor: modeller });
    }
  });
  return { seeded: true };
}
