// The one-line notice the order-list page shows after an add from a fix page, read from its query.
const problems: Record<string, string> = {
  'bad-form': 'That button sent something this page cannot read; nothing was added.',
  'not-found': 'That fix, revision or part could not be found (it may have been changed since); nothing was added.',
  'too-many': 'That fix lists too many parts to carry over at once; add them a few at a time.',
  'not-decoded': 'Those parts could not be read into the list; nothing was added.',
};

export function orderListNotice(query: URLSearchParams): string | null {
  const problem = query.get('problem');
  if (problem !== null) return problems[problem] ?? 'Something went wrong; nothing was added.';
  const added = Number(query.get('added'));
  if (Number.isInteger(added) && added > 0) return `Added ${added} ${added === 1 ? 'part' : 'parts'} to your saved list.`;
  return null;
}
