// The list of help and policy pages, shared by the help side list, the help index and the site footer.

export interface HelpPage {
  /** Path of the page, without a trailing slash. */
  href: string;
  /** Full title as the page's own heading shows it. */
  title: string;
  /** Short name for footers and side lists. */
  shortTitle: string;
  /** One sentence saying what the reader will find there. */
  summary: string;
}

export const helpPages: readonly HelpPage[] = [
  {
    href: '/help',
    title: 'Help and policies',
    shortTitle: 'Help',
    summary: 'Where to start: every help and policy page in one list.',
  },
  {
    href: '/help/writing-a-good-fix',
    title: 'Writing a good fix',
    shortTitle: 'Writing a good fix',
    summary: 'How to write up a symptom, its cause and the remedy so another technician can repeat it.',
  },
  {
    href: '/help/working-safely',
    title: 'Working safely',
    shortTitle: 'Working safely',
    summary: 'Mains, stored charge, lasers, heat, sharp edges and springs, and how to make each one safe.',
  },
  {
    href: '/help/house-rules',
    title: 'House rules',
    shortTitle: 'House rules',
    summary: 'What we expect from members who write, proof, report and discuss.',
  },
  {
    href: '/help/content-licence',
    title: 'Content licence',
    shortTitle: 'Content licence',
    summary: 'Fix text and photos are shared under CC BY-SA 4.0; how to reuse and credit them.',
  },
  {
    href: '/help/privacy',
    title: 'Privacy',
    shortTitle: 'Privacy',
    summary: 'What we store about you, what we never do, and how to delete your account.',
  },
];
