// The invented people of the demo world: one of each role, plus technicians who file bench reports.
import type { DemoUser } from './types';

/** Every address sits on the reserved `example.test` domain, so no mail can reach a real inbox. */
export const demoUsers: DemoUser[] = [
  { key: 'admin', email: 'admin@example.test', name: 'Orla Penhallow', role: 'admin' },
  { key: 'moderator', email: 'moderator@example.test', name: 'Ruben Altmark', shopName: 'Altmark Bench Repairs', role: 'moderator' },
  { key: 'moderator2', email: 'moderator2@example.test', name: 'Signe Varrow', role: 'moderator' },
  { key: 'editor', email: 'editor@example.test', name: 'Tobias Quennell', shopName: 'Quennell Tape & Disc', role: 'editor' },
  { key: 'member', email: 'member@example.test', name: 'Maren Holloway', role: 'member' },
  { key: 'tech-ansel', email: 'ansel.dravik@example.test', name: 'Ansel Dravik', shopName: 'Dravik Video Rescue', role: 'member' },
  { key: 'tech-celia', email: 'celia.brannock@example.test', name: 'Celia Brannock', role: 'member' },
  {
    key: 'tech-dmitri',
    email: 'dmitri.solberg@example.test',
    name: 'Dmitri Solberg',
    shopName: 'Northgate Archive Transfers',
    role: 'member',
  },
  { key: 'tech-esme', email: 'esme.haverty@example.test', name: 'Esme Haverty', role: 'member' },
  { key: 'tech-farid', email: 'farid.oakenby@example.test', name: 'Farid Oakenby', shopName: 'Oakenby Audio Workshop', role: 'member' },
  { key: 'tech-greta', email: 'greta.lindqvale@example.test', name: 'Greta Lindqvale', role: 'member' },
  {
    key: 'tech-hugo',
    email: 'hugo.marchetti@example.test',
    name: 'Hugo Marchetti-Vale',
    shopName: 'Two Reels Repair Co-op',
    role: 'member',
  },
  { key: 'tech-ilse', email: 'ilse.tamsin@example.test', name: 'Ilse Tamsin', role: 'member' },
  {
    key: 'tech-jonah',
    email: 'jonah.wrenfield@example.test',
    name: 'Jonah Wrenfield',
    shopName: 'Wrenfield Electronics Bench',
    role: 'member',
  },
  { key: 'tech-katya', email: 'katya.morrow@example.test', name: 'Katya Morrowby', role: 'member' },
  {
    key: 'tech-lucan',
    email: 'lucan.petrescu@example.test',
    name: 'Lucan Petrescu-Hale',
    shopName: 'Lantern Street Refurbs',
    role: 'member',
  },
  { key: 'tech-mina', email: 'mina.osgood@example.test', name: 'Mina Osgood', role: 'member' },
  { key: 'tech-nils', email: 'nils.harrowby@example.test', name: 'Nils Harrowby', shopName: 'Harrowby Deck Clinic', role: 'member' },
  { key: 'tech-oona', email: 'oona.fairleigh@example.test', name: 'Oona Fairleigh', role: 'member' },
];
