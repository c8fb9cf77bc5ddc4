// A realistic fix body for an invented VCR, using every node and mark a body may hold.
import type { BodyDoc, BodyNode } from '@/lib/tiptap/allowlist';

const text = (value: string, marks?: BodyNode['marks']): BodyNode =>
  marks ? { type: 'text', text: value, marks } : { type: 'text', text: value };
const paragraph = (...content: BodyNode[]): BodyNode => ({ type: 'paragraph', content });
const cell = (type: 'tableCell' | 'tableHeader', value: string): BodyNode => ({ type, content: [paragraph(text(value))] });

export const realisticBody: BodyDoc = {
  type: 'doc',
  content: [
    {
      type: 'caution',
      attrs: { kind: 'stored_charge' },
      content: [
        paragraph(
          text('The primary reservoir capacitor C801 can hold a charge after unplugging. '),
          text('Measure it', [{ type: 'bold' }]),
          text(' before touching the power board.'),
        ),
      ],
    },
    { type: 'heading', attrs: { level: 2 }, content: [text('Remedy')] },
    paragraph(
      text('The loading belt stretches with age, so the tray stalls half-way. See the '),
      text('belt size chart', [{ type: 'link', attrs: { href: 'https://example.org/belts?size=92&width=4' } }]),
      text(' or write to '),
      text('the parts desk', [{ type: 'link', attrs: { href: 'mailto:parts@example.org' } }]),
      text('.'),
      { type: 'hardBreak' },
      text('Old belts feel ', [{ type: 'italic' }]),
      text('sticky', [{ type: 'underline' }]),
      text(', never '),
      text('shiny', [{ type: 'strike' }]),
      text('; part code '),
      text('BLT-92x4', [{ type: 'code' }]),
      text('.'),
    ),
    {
      type: 'orderedList',
      attrs: { start: 1 },
      content: [
        { type: 'listItem', content: [paragraph(text('Unplug the deck and wait five minutes.'))] },
        {
          type: 'listItem',
          content: [
            paragraph(text('Remove the top cover (four screws).')),
            { type: 'bulletList', content: [{ type: 'listItem', content: [paragraph(text('Keep the long screws apart.'))] }] },
          ],
        },
      ],
    },
    {
      type: 'reading',
      attrs: {
        testPoint: 'TP7 (loading motor +)',
        expected: '9.5 V while loading',
        measured: '0 V or pulsing',
        note: 'Measure against chassis ground.',
      },
    },
    {
      type: 'figure',
      attrs: {
        src: '/media/deck/loading-belt.jpg',
        alt: 'Loading belt around the motor pulley, seen from above',
        caption: 'The loading belt, left of the cassette housing.',
      },
    },
    {
      type: 'image',
      attrs: { src: 'https://img.example.org/deck/underside.jpg', alt: 'Underside of the deck mechanism', title: 'Underside' },
    },
    {
      type: 'table',
      content: [
        { type: 'tableRow', content: [cell('tableHeader', 'Part'), cell('tableHeader', 'Value'), cell('tableHeader', 'Qty')] },
        { type: 'tableRow', content: [cell('tableCell', 'Loading belt'), cell('tableCell', '92 mm x 4 mm flat'), cell('tableCell', '1')] },
        {
          type: 'tableRow',
          content: [
            { type: 'tableCell', attrs: { colspan: 2, rowspan: 1 }, content: [paragraph(text('Capacitor C801, 100 uF 400 V'))] },
            cell('tableCell', '1'),
          ],
        },
      ],
    },
    { type: 'blockquote', content: [paragraph(text('Clean the pulley with isopropyl alcohol before fitting the new belt.'))] },
    { type: 'codeBlock', content: [text('ERR 7 → loading time-out')] },
    { type: 'horizontalRule' },
    { type: 'heading', attrs: { level: 3 }, content: [text('Test')] },
    paragraph(text('Load and eject a cassette ten times.')),
  ],
};
