// A job sheet's parts and its owner's order list, through the built server: take the list onto the job,
// put the job's parts back on the list, and refuse what would lose or mangle lines.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { signIn } from '../support/sign-in';
import { as, makeMember, makeWorld, PASSWORD, type TestWorld } from './bench-work-support';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let world: TestWorld;
let me: ReturnType<typeof as>;
let other: ReturnType<typeof as>;

const jobIdOf = (res: Response): string => (res.headers.get('location') ?? '').split('?')[0]!.split('/')[2]!;
const jobJson = async (id: string) => (await (await me.get(`/api/v1/job-sheets/${id}`)).json()).jobSheet;
const listJson = async (who: ReturnType<typeof as>) => (await who.get('/api/v1/order-list')).json();

async function putList(lines: unknown[]): Promise<void> {
  const res = await me.put('/api/v1/order-list', { lines });
  expect(res.status).toBe(200);
}

beforeAll(async () => {
  world = await makeWorld(knex);
  me = as(base, await signIn(base, (await makeMember(knex)).email, PASSWORD));
  other = as(base, await signIn(base, (await makeMember(knex)).email, PASSWORD));
});
afterAll(() => knex.destroy());

describe('parts between a job sheet and the order list', () => {
  it('copies the order list into parts used without spares, keeps the list unless asked, and decodes the rows back', async () => {
    const id = jobIdOf(
      await me.form('/jobs/new?_action=newJob', { customerRef: 'Bench 7', machine: world.machines[0]!.slug, status: 'diagnosing' }),
    );
    await putList([
      {
        key: 'capacitance:470 µF 16 V',
        label: '470 µF 16 V',
        kind: 'capacitor',
        quantity: 2,
        spares: 1,
        refs: ['C512', 'C513'],
        sources: ['Fix A'],
      },
      { key: 'belt:flat belt 92 mm', label: 'flat belt 92 mm', kind: 'belt', quantity: 1, spares: 0, sources: ['Fix B'] },
    ]);
    const taken = await me.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'take_order_list' });
    expect(taken.status).toBe(303);
    expect(taken.headers.get('location')).toBe(`/jobs/${id}?job=parts_taken#parts-used`);
    expect((await jobJson(id)).partsUsed).toEqual([
      { ref: 'C512 C513', kind: 'capacitor', value: '470 µF 16 V', rating: '', quantity: 2, notes: '', source: 'Fix A' },
      { ref: '', kind: 'belt', value: 'flat belt 92 mm', rating: '', quantity: 1, notes: '', source: 'Fix B' },
    ]);
    expect((await listJson(me)).lines).toHaveLength(2);

    // Back onto the list: the same canonical spec merges, so the capacitor line now counts 2 + 2.
    const listed = await me.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'to_order_list' });
    expect(listed.headers.get('location')).toBe(`/jobs/${id}?job=parts_listed#order-list-heading`);
    const lines = (await listJson(me)).lines as { key: string; quantity: number; sources: string[] }[];
    expect(lines).toHaveLength(2);
    expect(lines.find((l) => l.key.startsWith('capacitance:'))).toMatchObject({ quantity: 4 });
  });

  it('empties the order list when the box is ticked', async () => {
    const id = jobIdOf(await me.form('/jobs/new?_action=newJob', { customerRef: 'Bench 8', status: 'diagnosing' }));
    await putList([{ key: 'resistance:2.2 kΩ', label: '2.2 kΩ', kind: 'resistor', quantity: 3, spares: 0 }]);
    await me.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'take_order_list', clear: 'yes' });
    expect((await jobJson(id)).partsUsed).toMatchObject([{ kind: 'resistor', value: '2.2 kΩ', quantity: 3 }]);
    expect((await listJson(me)).lines).toEqual([]);
  });

  it('says so when the list is empty or a line is too large for a job row, and changes nothing', async () => {
    const id = jobIdOf(await me.form('/jobs/new?_action=newJob', { customerRef: 'Bench 9', status: 'diagnosing' }));
    await putList([]);
    const empty = await me.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'take_order_list' });
    expect(empty.status).toBe(400);
    expect(await empty.text()).toContain('Your order list is empty');
    await putList([{ key: 'resistance:1 kΩ', label: '1 kΩ', kind: 'resistor', quantity: 5000, spares: 0 }]);
    const tooMany = await me.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'take_order_list', clear: 'yes' });
    expect(tooMany.status).toBe(400);
    expect(await tooMany.text()).toContain('a job sheet row holds at most 999');
    expect((await jobJson(id)).partsUsed).toEqual([]);
    expect((await listJson(me)).lines).toHaveLength(1);
    const nothing = await me.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'to_order_list' });
    expect(nothing.status).toBe(400);
    expect(await nothing.text()).toContain('This job sheet lists no parts yet.');
  });

  it('names the sheet by number on the order list, so deleting the sheet leaves no customer reference behind', async () => {
    const id = jobIdOf(await me.form('/jobs/new?_action=newJob', { customerRef: 'Quillby invoice 0412', status: 'repaired' }));
    await me.form(`/jobs/${id}?_action=jobSheet`, {
      job: String(id),
      intent: 'save',
      customerRef: 'Quillby invoice 0412',
      status: 'repaired',
      'parts.0.kind': 'capacitor',
      'parts.0.value': '1000uF',
      'parts.0.rating': '25V',
      'parts.0.quantity': '1',
    });
    await putList([]);
    await me.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'to_order_list' });
    await me.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'delete', confirm: 'yes' });
    const list = await listJson(me);
    expect(list.lines).toMatchObject([{ kind: 'capacitor', quantity: 1, sources: [`Job sheet no. ${id}`] }]);
    expect(JSON.stringify(list)).not.toContain('Quillby');
  });

  it('answers 404 for another member’s job sheet and leaves both lists alone', async () => {
    const id = jobIdOf(await me.form('/jobs/new?_action=newJob', { customerRef: 'Bench 10', status: 'diagnosing' }));
    const res = await other.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'take_order_list' });
    expect(res.status).toBe(404);
    expect((await listJson(other)).lines).toEqual([]);
  });
});
