// One live result in the search box's list: thumbnail, highlighted title, machines, symptom snippet, bench score.
import type { ReactElement } from 'react';
import type { SearchHit } from '@/lib/search/result-types';
import { benchScoreText } from '@/lib/search/bench-label';

export interface ResultOptionProps {
  hit: SearchHit;
  id: string;
  active: boolean;
  onChoose: (hit: SearchHit) => void;
  onHover: () => void;
}

export function ResultOption({ hit, id, active, onChoose, onHover }: ResultOptionProps): ReactElement {
  const machines = hit.machines.slice(0, 3).map((m) => m.label);
  return (
    <li
      id={id}
      role="option"
      aria-selected={active}
      className={`flex cursor-pointer gap-3 border-b border-rule px-3 py-2 last:border-b-0 ${active ? 'bg-teal-wash' : 'bg-paper-light'}`}
      // mousedown, not click: the input keeps focus and the list does not close before the choice lands.
      onMouseDown={(event) => {
        event.preventDefault();
        onChoose(hit);
      }}
      onMouseEnter={onHover}
    >
      {hit.thumbnail && (
        <img
          src={hit.thumbnail.src}
          srcSet={hit.thumbnail.srcset || undefined}
          sizes="4.5rem"
          alt=""
          width={72}
          height={Math.round((72 * hit.thumbnail.height) / Math.max(1, hit.thumbnail.width))}
          loading="lazy"
          className="h-auto w-[4.5rem] flex-none rounded border border-rule object-cover"
        />
      )}
      <div className="min-w-0 flex-1 [&_mark.concept]:underline [&_mark.concept]:decoration-dotted [&_mark]:bg-amber-wash [&_mark]:text-ink">
        {/* titleHtml and snippetHtml are escaped on the server; the only tag in them is <mark> (a family match's carries a title). */}
        <span className="block font-serif font-semibold text-teal" dangerouslySetInnerHTML={{ __html: hit.titleHtml }} />
        {machines.length > 0 && (
          <span className="block font-mono text-xs text-ink-soft">
            {machines.join(', ')}
            {hit.machines.length > 3 ? ' …' : ''}
          </span>
        )}
        <span className="block text-sm text-ink-soft" dangerouslySetInnerHTML={{ __html: hit.snippetHtml }} />
        {hit.matched.length > 0 && <span className="block text-xs text-ink-soft">matched: {hit.matched.join('; ')}</span>}
        <span className="block text-xs font-semibold text-teal">{benchScoreText(hit.benchScore.score, hit.benchScore.reports)}</span>
      </div>
    </li>
  );
}
