// Test helper: parses rendered HTML with a real HTML parser (happy-dom) and lists anything that could run or load code.
import { Window } from 'happy-dom';

const window = new Window();

/** Elements that execute, embed or restyle; a fix body has no use for any of them. */
const forbiddenTags = [
  'script',
  'style',
  'iframe',
  'frame',
  'object',
  'embed',
  'applet',
  'svg',
  'math',
  'link',
  'meta',
  'base',
  'form',
  'input',
  'button',
  'textarea',
  'template',
  'noscript',
];
const urlAttributes = ['href', 'src', 'action', 'formaction', 'xlink:href', 'poster', 'srcset'];

export function parseHtml(html: string): HTMLElement {
  const container = window.document.createElement('div');
  container.innerHTML = html;
  return container as unknown as HTMLElement;
}

export function unsafeFindings(html: string): string[] {
  const findings: string[] = [];
  for (const element of Array.from(parseHtml(html).querySelectorAll('*'))) {
    const tag = element.tagName.toLowerCase();
    if (forbiddenTags.includes(tag)) findings.push(`element <${tag}>`);
    for (const attribute of Array.from(element.attributes)) {
      const name = attribute.name.toLowerCase();
      if (name.startsWith('on')) findings.push(`event handler ${tag}[${name}]`);
      if (name === 'style' || name === 'srcdoc') findings.push(`attribute ${tag}[${name}]`);
      if (urlAttributes.includes(name) && /^\s*(?:javascript|data|vbscript):/i.test(attribute.value)) {
        findings.push(`unsafe URL ${tag}[${name}]=${attribute.value}`);
      }
    }
  }
  return findings;
}

/** Every element in document order as "tag[attribute names]", for comparing two renderings' structure. */
export function tagOutline(html: string): string[] {
  return Array.from(parseHtml(html).querySelectorAll('*')).map((element) => {
    const names = Array.from(element.attributes)
      .map((attribute) => attribute.name)
      .sort();
    return `${element.tagName.toLowerCase()}[${names.join(',')}]`;
  });
}

export async function closeHtmlParser(): Promise<void> {
  await window.happyDOM.close();
}
