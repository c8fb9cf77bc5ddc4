// Seeds demo users, makers, chassis families, machines and word families by their natural keys (idempotent).
import type { Knex } from 'knex';
import { normaliseCode } from '@/lib/schemas/catalogue';
import { hashPassword } from '../auth/passwords';
import { demoUsers } from './demo/users';
import { demoMakers } from './demo/makers';
import { demoChassis } from './demo/chassis';
import { demoMachines } from './demo/machines';
import { demoWordFamilies } from './demo/word-families';

/** Documented in the README as demo-only. */
export const DEMO_PASSWORD = 'bench-demo-2026';

export const machineKey = (m: { makerSlug: string; modelNumber: string; region: string }) => `${m.makerSlug}/${m.modelNumber}/${m.region}`;
export const machineSlug = (m: { makerSlug: string; modelNumber: string; region: string }) =>
  `${m.makerSlug}-${normaliseCode(m.modelNumber)}-${m.region.toLowerCase()}`;

export interface SeededIds {
  users: Map<string, number>;
  makers: Map<string, number>;
  chassis: Map<string, number>;
  machines: Map<string, number>;
}

export async function seedCatalogue(knex: Knex): Promise<SeededIds> {
  const ids: SeededIds = { users: new Map(), makers: new Map(), chassis: new Map(), machines: new Map() };
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const u of demoUsers) {
    const existing = await knex('users').where({ email: u.email }).first('id');
    const id = existing
      ? existing.id
      : (
          await knex('users')
            .insert({
              email: u.email,
              name: u.name,
              shop_name: u.shopName ?? null,
              role: u.role,
              password_hash: passwordHash,
              emailVerified: new Date('2024-01-02T09:00:00Z'),
            })
            .returning('id')
        )[0].id;
    ids.users.set(u.key, id);
  }
  for (const m of demoMakers) {
    const [row] = await knex('makers')
      .insert({ slug: m.slug, name: m.name, country: m.country, about: m.about })
      .onConflict('slug')
      .merge(['name', 'country', 'about'])
      .returning('id');
    ids.makers.set(m.slug, row.id);
  }
  for (const c of demoChassis) {
    const makerId = required(ids.makers, c.makerSlug, 'maker');
    const [row] = await knex('chassis_families')
      .insert({ slug: c.slug, maker_id: makerId, name: c.name, code: c.code, device_type: c.deviceType, about: c.about })
      .onConflict('slug')
      .merge(['name', 'code', 'device_type', 'about'])
      .returning('id');
    ids.chassis.set(c.slug, row.id);
  }
  for (const m of demoMachines) {
    const [row] = await knex('machines')
      .insert({
        slug: machineSlug(m),
        maker_id: required(ids.makers, m.makerSlug, 'maker'),
        chassis_family_id: m.chassisSlug ? required(ids.chassis, m.chassisSlug, 'chassis family') : null,
        model_number: m.modelNumber,
        model_code: normaliseCode(m.modelNumber),
        region: m.region,
        device_type: m.deviceType,
        formats: m.formats,
        year_from: m.yearFrom,
        year_to: m.yearTo ?? null,
        about: m.about,
      })
      .onConflict('slug')
      .merge(['chassis_family_id', 'device_type', 'formats', 'year_from', 'year_to', 'about'])
      .returning('id');
    ids.machines.set(machineKey(m), row.id);
  }
  const editorId = ids.users.get('editor') ?? null;
  for (const w of demoWordFamilies) {
    await knex('word_families').insert({ name: w.name, terms: w.terms, created_by: editorId }).onConflict('name').ignore();
  }
  return ids;
}

export function required<K, V>(map: Map<K, V>, key: K, what: string): V {
  const value = map.get(key);
  if (value === undefined) throw new Error(`Demo world: unknown ${what} "${String(key)}"`);
  return value;
}
