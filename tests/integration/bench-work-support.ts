// Rows of their own for the bench work tests: members, a maker with a family and machines, fixes with revisions.
import type { Knex } from 'knex';
import { hashPassword } from '@/server/auth/passwords';

export const PASSWORD = 'bench-demo-2026';

let counter = 0;
/** A lower-case suffix unique to this run, so rows never collide with the demo world or earlier runs. */
export function unique(): string {
  counter += 1;
  return `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}${counter}`;
}

let passwordHash: Promise<string> | undefined;

export async function makeMember(
  knex: Knex,
  options: { verified?: boolean; shopName?: string | null; name?: string } = {},
): Promise<{ id: number; email: string; name: string }> {
  passwordHash ??= hashPassword(PASSWORD);
  const suffix = unique();
  const email = `bench-${suffix}@example.test`;
  const name = options.name ?? `Bench Tester ${suffix}`;
  const [row] = await knex('users')
    .insert({
      email,
      name,
      role: 'member',
      shop_name: options.shopName ?? null,
      password_hash: await passwordHash,
      emailVerified: options.verified === false ? null : new Date(),
    })
    .returning('id');
  return { id: row.id, email, name };
}

export interface TestWorld {
  makerId: number;
  chassisId: number;
  chassisSlug: string;
  makerSlug: string;
  /** Two machines in the family, and one outside it. */
  machines: { id: number; slug: string }[];
  outsider: { id: number; slug: string };
}

/** An invented maker of our own with one chassis family, two machines in it and one machine outside it. */
export async function makeWorld(knex: Knex): Promise<TestWorld> {
  const s = unique();
  const [maker] = await knex('makers')
    .insert({ slug: `tm-${s}`, name: `Testmark ${s}` })
    .returning(['id', 'slug']);
  const [chassis] = await knex('chassis_families')
    .insert({ slug: `tm-${s}-deck`, maker_id: maker.id, name: `Test deck ${s}`, code: `TD${s}`.toUpperCase(), device_type: 'vcr' })
    .returning(['id', 'slug']);
  const machine = async (n: string, chassisId: number | null) => {
    const [row] = await knex('machines')
      .insert({
        slug: `tm-${s}-${n}`,
        maker_id: maker.id,
        chassis_family_id: chassisId,
        model_number: `TM-${n}${s}`.toUpperCase(),
        model_code: `tm${n}${s}`,
        region: 'PAL',
        device_type: 'vcr',
      })
      .returning(['id', 'slug']);
    return row as { id: number; slug: string };
  };
  const machines = [await machine('100', chassis.id), await machine('200', chassis.id)];
  const outsider = await machine('900', null);
  return { makerId: maker.id, makerSlug: maker.slug, chassisId: chassis.id, chassisSlug: chassis.slug, machines, outsider };
}

export interface TestFix {
  id: number;
  slug: string;
  /** Proofed revisions r1..rn in order; the last is live. */
  revisionIds: number[];
}

const body = JSON.stringify({
  type: 'doc',
  content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Replace the worn belt and clean the pulleys.' }] }],
});

/** A live fix with `revisions` proofed revisions, applying to the given machines, with a search row. */
export async function makeFix(
  knex: Knex,
  options: {
    authorId: number;
    machineIds: number[];
    chassisIds?: number[];
    revisions?: number;
    cautions?: { kind: string; detail?: string }[];
    title?: string;
  },
): Promise<TestFix> {
  const proofer = await knex('users').where({ email: 'moderator@example.test' }).first('id');
  const s = unique();
  const [fix] = await knex('fixes')
    .insert({ slug: `test-fix-${s}`, created_by: options.authorId })
    .returning(['id', 'slug']);
  const revisionIds: number[] = [];
  const count = options.revisions ?? 1;
  for (let n = 1; n <= count; n++) {
    const [rev] = await knex('revisions')
      .insert({
        fix_id: fix.id,
        number: n,
        parent_revision_id: revisionIds.at(-1) ?? null,
        author_id: options.authorId,
        title: `${options.title ?? `Test fault ${s}`}${n > 1 ? ` (revised ${n})` : ''}`,
        body,
        symptoms: [`Symptom seen in r${n}`, 'Stops after a few seconds'],
        cause: `Worn drive belt, as found in r${n}.`,
        cautions: JSON.stringify(options.cautions ?? []),
        state: 'proofed',
        proofer_id: proofer.id,
        proofed_at: new Date(Date.now() - (count - n) * 86_400_000),
      })
      .returning('id');
    revisionIds.push(rev.id);
    for (const machineId of options.machineIds) await knex('revision_machines').insert({ revision_id: rev.id, machine_id: machineId });
    for (const chassisId of options.chassisIds ?? [])
      await knex('revision_chassis').insert({ revision_id: rev.id, chassis_family_id: chassisId });
  }
  const live = revisionIds.at(-1) as number;
  await knex('fixes').where({ id: fix.id }).update({ current_revision_id: live });
  for (const machineId of options.machineIds) await knex('fix_machines').insert({ fix_id: fix.id, machine_id: machineId });
  for (const chassisId of options.chassisIds ?? []) await knex('fix_chassis').insert({ fix_id: fix.id, chassis_family_id: chassisId });
  await knex('fix_search').insert({ fix_id: fix.id, revision_id: live, title: `Test fault ${s}`, proofed_at: new Date() });
  return { id: fix.id, slug: fix.slug, revisionIds };
}

/** A new proofed revision on top of the live one: the fix "changes" after a note was made. */
export async function proofNewRevision(knex: Knex, fix: TestFix, authorId: number): Promise<number> {
  const proofer = await knex('users').where({ email: 'moderator@example.test' }).first('id');
  const number = fix.revisionIds.length + 1;
  const [rev] = await knex('revisions')
    .insert({
      fix_id: fix.id,
      number,
      parent_revision_id: fix.revisionIds.at(-1),
      author_id: authorId,
      title: `Rewritten fault r${number}`,
      body,
      symptoms: [`Symptom rewritten in r${number}`],
      cause: `A different cause, written in r${number}.`,
      state: 'proofed',
      proofer_id: proofer.id,
      proofed_at: new Date(),
    })
    .returning('id');
  fix.revisionIds.push(rev.id);
  await knex('fixes').where({ id: fix.id }).update({ current_revision_id: rev.id });
  return rev.id;
}

/** Requests as a signed-in member (or signed out with an empty cookie), with the Origin a browser sends. */
export function as(base: string, cookie: string) {
  const send = (method: string, path: string, body?: unknown, headers: Record<string, string> = {}) =>
    fetch(`${base}${path}`, {
      method,
      redirect: 'manual',
      headers: {
        Origin: base,
        ...(cookie ? { Cookie: cookie } : {}),
        ...(body !== undefined && !(body instanceof URLSearchParams) ? { 'Content-Type': 'application/json' } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : body instanceof URLSearchParams ? body : JSON.stringify(body),
    });
  return {
    get: (path: string, headers?: Record<string, string>) => send('GET', path, undefined, headers),
    post: (path: string, body?: unknown) => send('POST', path, body),
    patch: (path: string, body: unknown) => send('PATCH', path, body),
    put: (path: string, body: unknown) => send('PUT', path, body),
    delete: (path: string) => send('DELETE', path),
    form: (path: string, fields: Record<string, string> | [string, string][]) => send('POST', path, new URLSearchParams(fields)),
    /** A POST with a body and content type exactly as given (for malformed input). */
    raw: (path: string, body: string, type: string) =>
      fetch(`${base}${path}`, {
        method: 'POST',
        redirect: 'manual',
        headers: { Origin: base, 'Content-Type': type, ...(cookie ? { Cookie: cookie } : {}) },
        body,
      }),
  };
}
