// @vitest-environment happy-dom
// Office list paragraphs (mso-list styles with typed-out markers) become nested <ol>/<ul>; everything else is left alone.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { officeListsToHtmlLists } from '@/islands/editor/office-lists';

const fixture = readFileSync(join(process.cwd(), 'tests/fixtures/clipboard/office-lists.html'), 'utf8');

function item(text: string, marker: string, level = 1, list = 'l0', markerStyle = ''): string {
  const wrapOpen = markerStyle ? `<span style='${markerStyle}'>` : '';
  const wrapClose = markerStyle ? '</span>' : '';
  return (
    `<p class=MsoListParagraphCxSpMiddle style='margin-left:${36 * level}.0pt;text-indent:-18.0pt;mso-list:${list} level${level} lfo1'>` +
    `<![if !supportLists]>${wrapOpen}<span style='mso-list:Ignore'>${marker}<span style='font:7.0pt "Times New Roman"'>&nbsp;&nbsp;&nbsp; </span></span>${wrapClose}<![endif]>` +
    `${text}</p>`
  );
}

function converted(html: string): HTMLElement {
  const body = document.createElement('div');
  body.innerHTML = officeListsToHtmlLists(html);
  return body;
}

// Element children only, as tag names, so the shape reads at a glance.
function shape(el: Element): string {
  const kids = Array.from(el.children).filter((c) => ['OL', 'UL', 'LI', 'P'].includes(c.tagName));
  return kids.map((c) => c.tagName.toLowerCase() + (shape(c) ? `(${shape(c)})` : '')).join(' ');
}

afterEach(() => vi.unstubAllGlobals());

describe('officeListsToHtmlLists', () => {
  it('makes one numbered list with a bullet list nested in the item above the bullets', () => {
    const body = converted(item('Remove the cover', '1.') + item('Keep the screws', 'o', 2) + item('Fit the belt', '2.'));
    expect(shape(body)).toBe('ol(li(p ul(li(p))) li(p))');
    expect(body.querySelector('ol > li:nth-child(1) > ul > li')?.textContent).toBe('Keep the screws');
  });

  it('tells numbers and letters from bullets by the marker and its font', () => {
    const cases: [string, string, 'OL' | 'UL'][] = [
      ['1.', '', 'OL'],
      ['2)', '', 'OL'],
      ['(a)', '', 'OL'],
      ['iv.', '', 'OL'],
      ['1.2.', '', 'OL'],
      ['o', "font-family:'Courier New'", 'UL'],
      ['-', '', 'UL'],
      ['•', '', 'UL'],
      ['·', 'font-family:Symbol;mso-fareast-font-family:Symbol', 'UL'],
      ['§', 'font-family:Wingdings;mso-fareast-font-family:Wingdings', 'UL'],
      // A letter in a symbol font is a picture of a bullet, not a letter.
      ['l.', 'font-family:Wingdings', 'UL'],
    ];
    for (const [marker, style, tag] of cases) {
      expect(converted(item('Step', marker, 1, 'l0', style)).firstElementChild?.tagName, marker).toBe(tag);
    }
  });

  it('removes the marker spans and the conditional comments around them', () => {
    const html = converted(
      item('Remove the cover', '1.') +
        item('Check the strap', '·', 2, 'l0', 'font-family:Symbol').replace(/<!\[(if !supportLists|endif)\]>/g, '<!--[$1]-->'),
    ).innerHTML;
    expect(html).not.toContain('mso-list');
    expect(html).not.toContain('supportLists');
    expect(html).not.toContain('endif');
    expect(html).not.toContain('1.');
    expect(html).not.toContain('·');
    expect(html).not.toContain('Times New Roman');
    expect(html).toBe('<ol><li><p>Remove the cover</p><ul><li><p>Check the strap</p></li></ul></li></ol>');
  });

  it('starts a new list when a normal paragraph interrupts the run, and keeps counting from the marker', () => {
    const body = converted(item('Open the deck', '1.') + '<p class=MsoNormal>Let it cool.</p>' + item('Fit the roller', '2.'));
    expect(shape(body)).toBe('ol(li(p)) p ol(li(p))');
    expect(body.querySelectorAll('ol')[1]?.getAttribute('start')).toBe('2');
    expect(body.querySelector('ol')?.hasAttribute('start')).toBe(false);
  });

  it('starts a new list at the same level when the list or its kind changes', () => {
    expect(shape(converted(item('One', '1.') + item('Two', '·', 1, 'l1', 'font-family:Symbol')))).toBe('ol(li(p)) ul(li(p))');
    expect(shape(converted(item('One', '1.') + item('Other list', '1.', 1, 'l3')))).toBe('ol(li(p)) ol(li(p))');
  });

  it('reads MsoNormal paragraphs with an mso-list style as items too, and a skipped level nests once', () => {
    const normal = `<p class=MsoNormal style='mso-list:l0 level1 lfo1'><span style='mso-list:Ignore'>1.</span>Drain the capacitor</p>`;
    expect(shape(converted(normal + item('Deep', '-', 3)))).toBe('ol(li(p ul(li(p))))');
  });

  it('puts a marker-less list paragraph under the item above it instead of ending the list', () => {
    const continuation = `<p class=MsoListParagraphCxSpMiddle style='margin-left:36.0pt'>Use the long screwdriver here.</p>`;
    const body = converted(item('Open the deck', '1.') + continuation + item('Fit the roller', '2.'));
    expect(shape(body)).toBe('ol(li(p p) li(p))');
  });

  it('keeps the other content where it was, before and after the list', () => {
    const body = converted(`<h2>Belt</h2>\n<p>Before</p>\n${item('Step', '1.')}\n<table><tr><td>Part</td></tr></table><p>After</p>`);
    expect(Array.from(body.children).map((c) => c.tagName)).toEqual(['H2', 'P', 'OL', 'TABLE', 'P']);
  });

  it('converts the office clipboard fixture into two lists around the interrupting paragraph', () => {
    const body = converted(fixture);
    expect(shape(body)).toBe('p ol(li(p) li(p ul(li(p) li(p))) li(p)) p ul(li(p) li(p))');
    expect(body.querySelector('li b')?.textContent).toBe('head cleaning');
  });

  it('gives back a whole document when handed one, and a fragment when handed a fragment', () => {
    expect(officeListsToHtmlLists(fixture)).toMatch(/^<html[\s>]/);
    expect(officeListsToHtmlLists(item('Step', '1.'))).toMatch(/^<ol><li><p>Step<\/p><\/li><\/ol>$/);
  });

  it('leaves HTML without office lists exactly as it was', () => {
    const ordinary = readFileSync(join(process.cwd(), 'tests/fixtures/clipboard/word-processor.html'), 'utf8');
    expect(officeListsToHtmlLists(ordinary)).toBe(ordinary);
    const mentionsOnly = `<p style='mso-list:Ignore'>no level here</p><h1 style='mso-list:l0 level1 lfo1'>1. A numbered heading</h1>`;
    expect(officeListsToHtmlLists(mentionsOnly)).toBe(mentionsOnly);
  });

  it('gives garbage back unchanged and never throws', () => {
    for (const garbage of ['', '<<<>>', 'mso-list: level1 <p', '<p style="mso-list:', '\u0000mso-list\uffff']) {
      expect(officeListsToHtmlLists(garbage)).toBe(garbage);
    }
    expect(officeListsToHtmlLists(undefined as unknown as string)).toBeUndefined();
  });

  it('gives the input back when the DOM parser fails', () => {
    vi.stubGlobal(
      'DOMParser',
      class {
        parseFromString(): never {
          throw new Error('no parser here');
        }
      },
    );
    const html = item('Step', '1.');
    expect(officeListsToHtmlLists(html)).toBe(html);
  });
});
