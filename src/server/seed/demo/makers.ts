// The invented makers of the demo world; none of them is, or is meant to resemble, a real brand.
import type { DemoMaker } from './types';

export const demoMakers: DemoMaker[] = [
  {
    slug: 'quillmere',
    name: 'Quillmere',
    country: 'Estmark',
    about:
      'Quillmere built sturdy home video recorders around a single deck mechanism it kept in production for most of a decade. Its later combination units paired that tape know-how with a bought-in DVD loader.',
  },
  {
    slug: 'tamberlyn',
    name: 'Tamberlyn',
    country: 'Valdoria',
    about:
      'Tamberlyn moved from budget video recorders to DVD recorders early and sold them in large numbers. Its machines are easy to open, which makes them a common sight on repair benches.',
  },
  {
    slug: 'orvalle',
    name: 'Orvalle',
    country: 'Corvania',
    about:
      'Orvalle championed rewritable DVD-RAM recording for archive and broadcast users. Its recorders are well built but run warm, and their power supplies show their age first.',
  },
  {
    slug: 'brindlecote',
    name: 'Brindlecote Sound',
    country: 'Ostrel',
    about:
      'Brindlecote Sound made hi-fi separates, best known for a family of belt-driven cassette decks. A single CD player rounded out its range late in its life.',
  },
  {
    slug: 'kestrune',
    name: 'Kestrune',
    country: 'Norvessa',
    about:
      'Kestrune designed its own CD transport and laser platform and used it across several generations of players. It also sold a small DV camcorder, a compact DVD recorder and a MiniDisc deck.',
  },
  {
    slug: 'halvorin',
    name: 'Halvorin',
    country: 'Kaldera',
    about:
      'Halvorin made compact tape camcorders and, before that, a short-lived line of Betamax recorders. Its camcorder tape mechanism is small, dense and full of tiny springs.',
  },
];
