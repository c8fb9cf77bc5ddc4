// Checks that the invented demo world holds together: counts, references, schemas, body vocabulary, cautions.
import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { cautionSchema, difficultySchema, partRowSchema, readingSchema } from '@/lib/schemas/revision';
import { deviceTypeSchema, mediaFormatSchema, normaliseCode, regionSchema } from '@/lib/schemas/catalogue';
import { demoChassis } from '@/server/seed/demo/chassis';
import { demoFixes } from '@/server/seed/demo/fixes';
import { drawIllustration, illustrationKeys } from '@/server/seed/demo/illustrations';
import { demoMachines, machineKey } from '@/server/seed/demo/machines';
import { demoMakers } from '@/server/seed/demo/makers';
import type { DemoRevision, TiptapNode } from '@/server/seed/demo/types';
import { demoUsers } from '@/server/seed/demo/users';
import { demoWordFamilies } from '@/server/seed/demo/word-families';

const allRevisions: DemoRevision[] = demoFixes.flatMap((fix) => fix.revisions);
const revisionsWithLabels = demoFixes.flatMap((fix) => fix.revisions.map((revision, i) => ({ label: `${fix.slug} r${i + 1}`, revision })));

// The node and mark vocabulary agreed for remedy bodies (Tiptap StarterKit names plus our own three nodes).
const allowedNodes = new Set([
  'doc',
  'paragraph',
  'text',
  'heading',
  'bulletList',
  'orderedList',
  'listItem',
  'blockquote',
  'codeBlock',
  'hardBreak',
  'horizontalRule',
  'table',
  'tableRow',
  'tableHeader',
  'tableCell',
  'image',
  'caution',
  'reading',
  'figure',
]);
const allowedMarks = new Set(['bold', 'italic', 'strike', 'code', 'underline', 'link']);
const cautionKinds = new Set(['mains', 'stored_charge', 'laser', 'heat', 'sharp_edges', 'spring']);

function walk(node: TiptapNode, visit: (n: TiptapNode) => void): void {
  visit(node);
  for (const child of node.content ?? []) walk(child, visit);
}

function bodyText(node: TiptapNode): string {
  const texts: string[] = [];
  walk(node, (n) => {
    if (n.type === 'text' && n.text) texts.push(n.text);
    if (n.type === 'reading' && n.attrs) texts.push(Object.values(n.attrs).join(' '));
  });
  return texts.join(' ');
}

/** Every problem with one body, as readable strings; an empty list means the body is in vocabulary. */
function vocabularyProblems(body: TiptapNode): string[] {
  const problems: string[] = [];
  walk(body, (n) => {
    if (!allowedNodes.has(n.type)) problems.push(`node type ${n.type}`);
    for (const mark of n.marks ?? []) {
      if (!allowedMarks.has(mark.type)) problems.push(`mark type ${mark.type}`);
      if (mark.type === 'link' && !/^(https?:|mailto:)/.test(String(mark.attrs?.href ?? ''))) problems.push('link scheme');
    }
    if (n.type === 'text' && !n.text) problems.push('empty text node');
    if (n.type === 'heading' && ![2, 3, 4].includes(Number(n.attrs?.level))) problems.push('heading level');
    if (n.type === 'caution' && !cautionKinds.has(String(n.attrs?.kind))) problems.push(`caution kind ${String(n.attrs?.kind)}`);
    if (n.type === 'reading') {
      const parsed = readingSchema.safeParse(n.attrs ?? {});
      if (!parsed.success) problems.push('reading attrs');
    }
    if ((n.type === 'figure' || n.type === 'image') && !String(n.attrs?.alt ?? '').trim()) problems.push('image without alt');
  });
  return problems;
}

function sentenceCount(text: string): number {
  return text.split(/[.!?](?:\s+|$)/).filter((s) => s.trim().length > 0).length;
}

describe('demo catalogue', () => {
  it('holds enough makers, chassis families and machines', () => {
    expect(demoMakers.length).toBeGreaterThanOrEqual(4);
    expect(demoChassis.length).toBeGreaterThanOrEqual(6);
    expect(demoMachines.length).toBeGreaterThanOrEqual(24);
  });

  it('covers the seven device types of the demo and both PAL and NTSC', () => {
    const types = new Set(demoMachines.map((m) => m.deviceType));
    for (const t of ['vcr', 'dvd_recorder', 'dvd_ram_recorder', 'vhs_dvd_combo', 'camcorder', 'cassette_deck', 'cd_player']) {
      expect(types, t).toContain(t);
    }
    const regions = new Set(demoMachines.map((m) => m.region));
    expect(regions).toContain('PAL');
    expect(regions).toContain('NTSC');
  });

  it('offers the same model number in two regions at least once', () => {
    const byModel = new Map<string, Set<string>>();
    for (const m of demoMachines)
      byModel.set(`${m.makerSlug}/${m.modelNumber}`, (byModel.get(`${m.makerSlug}/${m.modelNumber}`) ?? new Set()).add(m.region));
    expect([...byModel.values()].some((regions) => regions.size >= 2)).toBe(true);
  });

  it('has a model number that extends another, so loose typing has to tell them apart', () => {
    const codes = demoMachines.map((m) => normaliseCode(m.modelNumber));
    expect(codes.some((a) => codes.some((b) => a !== b && b.startsWith(a)))).toBe(true);
  });

  it('keeps slugs and machine keys unique', () => {
    const makerSlugs = demoMakers.map((m) => m.slug);
    const chassisSlugs = demoChassis.map((c) => c.slug);
    const keys = demoMachines.map(machineKey);
    expect(new Set(makerSlugs).size).toBe(makerSlugs.length);
    expect(new Set(chassisSlugs).size).toBe(chassisSlugs.length);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('resolves every maker and chassis reference and keeps device types consistent', () => {
    const makerSlugs = new Set(demoMakers.map((m) => m.slug));
    const chassisBySlug = new Map(demoChassis.map((c) => [c.slug, c]));
    for (const c of demoChassis) expect(makerSlugs, c.slug).toContain(c.makerSlug);
    for (const m of demoMachines) {
      expect(makerSlugs, machineKey(m)).toContain(m.makerSlug);
      if (m.chassisSlug) expect(chassisBySlug.get(m.chassisSlug)?.deviceType, machineKey(m)).toBe(m.deviceType);
    }
  });

  it('uses only the catalogue vocabularies and years between 1985 and 2012', () => {
    for (const m of demoMachines) {
      const key = machineKey(m);
      expect(deviceTypeSchema.safeParse(m.deviceType).success, key).toBe(true);
      expect(regionSchema.safeParse(m.region).success, key).toBe(true);
      expect(m.formats.length, key).toBeGreaterThan(0);
      for (const f of m.formats) expect(mediaFormatSchema.safeParse(f).success, `${key} ${f}`).toBe(true);
      expect(m.yearFrom, key).toBeGreaterThanOrEqual(1985);
      expect(m.yearTo ?? m.yearFrom, key).toBeLessThanOrEqual(2012);
      expect(m.yearTo ?? m.yearFrom, key).toBeGreaterThanOrEqual(m.yearFrom);
      expect(m.modelNumber, key).toMatch(/^[A-Z]+-\d+[A-Z]?$/);
    }
  });

  it('gives every maker a country and an about text of two sentences', () => {
    for (const m of demoMakers) {
      expect(m.country.trim(), m.slug).not.toBe('');
      expect(sentenceCount(m.about), m.slug).toBe(2);
    }
  });
});

describe('demo users', () => {
  it('has one account for each named role and unique keys and addresses on example.test', () => {
    const byKey = new Map(demoUsers.map((u) => [u.key, u]));
    expect(byKey.get('admin')?.role).toBe('admin');
    expect(byKey.get('moderator')?.role).toBe('moderator');
    expect(byKey.get('moderator2')?.role).toBe('moderator');
    expect(byKey.get('editor')?.role).toBe('editor');
    expect(byKey.get('member')?.role).toBe('member');
    expect(demoUsers.length).toBeGreaterThanOrEqual(19);
    expect(byKey.size).toBe(demoUsers.length);
    expect(new Set(demoUsers.map((u) => u.email)).size).toBe(demoUsers.length);
    for (const u of demoUsers) expect(u.email, u.key).toMatch(/^[a-z0-9.]+@example\.test$/);
  });
});

describe('demo fixes', () => {
  const machineKeys = new Set(demoMachines.map(machineKey));
  const chassisSlugs = new Set(demoChassis.map((c) => c.slug));
  const roleOf = new Map(demoUsers.map((u) => [u.key, u.role]));

  it('holds enough fixes, and enough with several revisions', () => {
    expect(demoFixes.length).toBeGreaterThanOrEqual(40);
    expect(demoFixes.filter((f) => f.revisions.length >= 2).length).toBeGreaterThanOrEqual(12);
    for (const f of demoFixes) expect(f.revisions.length, f.slug).toBeGreaterThanOrEqual(1);
  });

  it('keeps fix slugs unique and URL-safe', () => {
    const slugs = demoFixes.map((f) => f.slug);
    expect(new Set(slugs).size).toBe(slugs.length);
    for (const s of slugs) expect(s).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
  });

  it('points only at machines and chassis families that exist, one to four machines or a chassis', () => {
    for (const f of demoFixes) {
      for (const key of f.machines) expect(machineKeys, `${f.slug} → ${key}`).toContain(key);
      for (const slug of f.chassis) expect(chassisSlugs, `${f.slug} → ${slug}`).toContain(slug);
      expect(f.machines.length, f.slug).toBeLessThanOrEqual(4);
      expect(f.machines.length + f.chassis.length, f.slug).toBeGreaterThan(0);
    }
  });

  it('parses every structured field with the shared schemas, unchanged', () => {
    for (const { label, revision } of revisionsWithLabels) {
      for (const part of revision.parts) expect(partRowSchema.parse(part), label).toEqual(part);
      for (const reading of revision.readings) expect(readingSchema.parse(reading), label).toEqual(reading);
      for (const caution of revision.cautions) expect(cautionSchema.parse(caution), label).toEqual(caution);
      expect(difficultySchema.safeParse(revision.difficulty).success, label).toBe(true);
      expect(Number.isInteger(revision.timeMinutes) && revision.timeMinutes > 0, label).toBe(true);
    }
  });

  it('gives every revision a title, one to four symptoms, a cause of two to four sentences and an edit summary', () => {
    for (const { label, revision } of revisionsWithLabels) {
      expect(revision.title.trim(), label).not.toBe('');
      expect(revision.symptoms.length, label).toBeGreaterThanOrEqual(1);
      expect(revision.symptoms.length, label).toBeLessThanOrEqual(4);
      const sentences = sentenceCount(revision.cause);
      expect(sentences >= 2 && sentences <= 4, `${label}: ${sentences} sentences`).toBe(true);
      expect(revision.editSummary.trim(), label).not.toBe('');
    }
  });

  it('has authors and moderator proofers that exist, and nobody proofs their own revision', () => {
    for (const { label, revision } of revisionsWithLabels) {
      expect(roleOf.has(revision.author), label).toBe(true);
      expect(roleOf.get(revision.proofer), label).toBe('moderator');
      expect(revision.author, label).not.toBe(revision.proofer);
    }
  });

  it('writes every body as a doc with steps, using only the agreed nodes and marks', () => {
    for (const { label, revision } of revisionsWithLabels) {
      expect(revision.body.type, label).toBe('doc');
      expect(vocabularyProblems(revision.body), label).toEqual([]);
      expect(
        revision.body.content.some((n) => n.type === 'orderedList'),
        label,
      ).toBe(true);
    }
  });

  it('carries a mains caution wherever the body mentions mains, and a laser caution wherever it mentions a laser', () => {
    for (const { label, revision } of revisionsWithLabels) {
      const text = bodyText(revision.body);
      const kinds = revision.cautions.map((c) => c.kind);
      if (/\bmains\b/i.test(text)) expect(kinds, `${label} mentions mains`).toContain('mains');
      if (/\blaser\b/i.test(text)) expect(kinds, `${label} mentions a laser`).toContain('laser');
    }
  });

  it('lists exactly the caution kinds whose boxes appear in the body, each deferring to local codes', () => {
    for (const { label, revision } of revisionsWithLabels) {
      const boxKinds = new Set<string>();
      walk(revision.body, (n) => {
        if (n.type === 'caution') boxKinds.add(String(n.attrs?.kind));
      });
      expect(new Set(revision.cautions.map((c) => c.kind)), label).toEqual(boxKinds);
      for (const c of revision.cautions) expect(c.detail, `${label} ${c.kind}`).toContain('local electrical codes and licensed practice');
    }
  });

  it('puts a caution before the first list of steps whenever a body has both', () => {
    for (const { label, revision } of revisionsWithLabels) {
      const blocks = revision.body.content;
      const firstCaution = blocks.findIndex((n) => n.type === 'caution');
      const firstSteps = blocks.findIndex((n) => n.type === 'orderedList');
      if (firstCaution >= 0 && firstSteps >= 0) expect(firstCaution, label).toBeLessThan(firstSteps);
    }
  });

  it('attaches illustrations to about a quarter of revisions, each with a known drawing and its own alt text', () => {
    const illustrated = allRevisions.filter((r) => (r.illustrations ?? []).length > 0);
    expect(illustrated.length / allRevisions.length).toBeGreaterThanOrEqual(0.2);
    expect(illustrated.length / allRevisions.length).toBeLessThanOrEqual(0.35);
    const used = new Set(illustrated.flatMap((r) => (r.illustrations ?? []).map((ill) => ill.drawing)));
    for (const key of illustrationKeys) expect(used, `drawing ${key} is never attached`).toContain(key);
    for (const { label, revision } of revisionsWithLabels) {
      for (const ill of revision.illustrations ?? []) {
        expect(illustrationKeys, label).toContain(ill.drawing);
        expect(ill.alt.trim(), label).not.toBe('');
        expect(ill.alt, label).not.toBe(ill.caption);
      }
    }
  });
});

describe('drawIllustration', () => {
  it('has at least six drawings', () => {
    expect(illustrationKeys.length).toBeGreaterThanOrEqual(6);
  });

  it('renders each key as a 1600 by 1200 SVG labelled as an illustration that an SVG parser accepts', async () => {
    for (const key of illustrationKeys) {
      const svg = drawIllustration(key);
      expect(svg.startsWith('<svg'), key).toBe(true);
      expect(svg, key).toContain('viewBox="0 0 1600 1200"');
      expect(svg, key).toContain('Illustration');
      expect(svg, key).toContain('#f6f1e7');
      // libvips (through sharp) parses the document; malformed markup throws here.
      const meta = await sharp(Buffer.from(svg)).metadata();
      expect(meta.format, key).toBe('svg');
      expect([meta.width, meta.height], key).toEqual([1600, 1200]);
    }
  });

  it('answers an unknown key with an error that names the known drawings', () => {
    expect(() => drawIllustration('no-such-drawing')).toThrow(/No illustration called "no-such-drawing".*belt-path/);
  });
});

describe('demo word families', () => {
  it('holds at least 32 uniquely named families, each with two or more distinct terms', () => {
    expect(demoWordFamilies.length).toBeGreaterThanOrEqual(32);
    expect(new Set(demoWordFamilies.map((f) => f.name)).size).toBe(demoWordFamilies.length);
    for (const family of demoWordFamilies) {
      const distinct = new Set(family.terms.map((t) => t.trim().toLowerCase()).filter(Boolean));
      expect(distinct.size, family.name).toBeGreaterThanOrEqual(2);
      expect(distinct.size, family.name).toBe(family.terms.length);
    }
  });
});
