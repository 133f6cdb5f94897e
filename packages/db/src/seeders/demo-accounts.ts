import type { Role } from '../entities';

/**
 * The demo firm and its sign-ins. Invented: the firm, its people and its address are ours.
 * `npm start` prints this table and the README lists it; keep the two in step.
 */
export const DEMO_FIRM = {
  name: 'Nightjar Garden Lighting Ltd',
  addressLines: 'Unit 4, Mallow Yard\nBramcote Lane\nFernhollow\nFH3 7QT',
  vatNumber: 'GB 000 4821 77',
  currency: 'GBP',
  locale: 'en-GB',
  termsText:
    'This quotation is valid for 30 days. A deposit secures your installation date; the balance is due on completion. ' +
    'Any mains electrical work is carried out and certified by a registered electrician under the current wiring regulations.',
} as const;

export interface DemoAccount {
  role: Role;
  name: string;
  email: string;
  password: string;
}

export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { role: 'owner', name: 'Harriet Quayle', email: 'harriet@nightjar.example', password: 'dusk-owner-2026' },
  { role: 'estimator', name: 'Tomasz Ellery', email: 'tomasz@nightjar.example', password: 'dusk-estimate-2026' },
  { role: 'estimator', name: 'Priya Venn', email: 'priya@nightjar.example', password: 'dusk-estimate-2026' },
  { role: 'installer', name: 'Callum Brathwaite', email: 'callum@nightjar.example', password: 'dusk-install-2026' },
];
