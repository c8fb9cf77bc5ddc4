// The list of fixes kept for the bench, on the kept page and the offline page: each with its revision, a link and Drop.
import { keptFixes } from './outbox-store';
import { dropFix } from './keep';

const keptOn = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric' });

async function render(list: HTMLElement): Promise<void> {
  const fixes = await keptFixes().catch(() => []);
  const empty = list.parentElement?.querySelector<HTMLElement>('[data-kept-empty]');
  if (empty) empty.hidden = fixes.length > 0;
  list.replaceChildren(
    ...fixes.map((fix) => {
      const item = document.createElement('li');
      item.className = 'kept-item';
      const link = document.createElement('a');
      link.href = `/fixes/${fix.slug}`;
      link.className = 'text-teal underline';
      link.textContent = fix.title;
      const detail = document.createElement('span');
      detail.className = 'text-ink-soft';
      detail.textContent = ` r${fix.revision}, kept ${keptOn.format(new Date(fix.keptAt))} `;
      const drop = document.createElement('button');
      drop.type = 'button';
      drop.className = 'btn btn-quiet';
      drop.textContent = 'Drop';
      drop.setAttribute('aria-label', `Drop “${fix.title}” from this device`);
      drop.addEventListener('click', () => {
        void dropFix(fix.slug).then(() => render(list));
      });
      item.append(link, detail, drop);
      return item;
    }),
  );
}

for (const list of document.querySelectorAll<HTMLElement>('[data-kept-list]')) void render(list);
