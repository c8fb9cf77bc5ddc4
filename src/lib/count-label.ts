// Counted nouns for page text ("1 fix", "4 bench reports"), built in one place so a
// template's line wrapping can never put stray spaces inside the phrase.
export function countLabel(count: number, singular: string, plural: string): string {
  return `${count} ${count === 1 ? singular : plural}`;
}

export function familyWorkLabel(counts: { fixes: number; reports: number }): string {
  return `${countLabel(counts.fixes, 'fix', 'fixes')} · ${countLabel(counts.reports, 'bench report', 'bench reports')}`;
}
