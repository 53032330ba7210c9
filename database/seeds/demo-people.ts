/**
 * The invented people of the demo project "Halvercote Yard" (product.md).
 * Plain data, so `npm start` can print the sign-ins without a database.
 */
export interface DemoPerson {
  email: string;
  name: string;
  /** Project role on the demo project, or 'admin' for the account-wide admin. */
  role: 'admin' | 'manager' | 'engineer' | 'checker' | 'viewer';
}

/** One password for every demo account (documented in the README and printed by `npm start`). */
export const DEMO_PASSWORD = 'halvercote-demo';

export const DEMO_PEOPLE: readonly DemoPerson[] = [
  { email: 'admin@halvercote.example', name: 'Rowan Adeyemi', role: 'admin' },
  { email: 'mireille.fontaine@halvercote.example', name: 'Mireille Fontaine', role: 'manager' },
  { email: 'kasimir.oduya@halvercote.example', name: 'Kasimir Oduya', role: 'engineer' },
  { email: 'ines.okafor@halvercote.example', name: 'Ines Okafor', role: 'checker' },
  { email: 'tomas.brandvik@halvercote.example', name: 'Tomas Brandvik', role: 'checker' },
  { email: 'priya.castellanos@halvercote.example', name: 'Priya Castellanos', role: 'checker' },
  { email: 'dalia.stroud@halvercote.example', name: 'Dalia Stroud', role: 'viewer' },
];

export const DEMO_PROJECT = {
  name: 'Halvercote Yard',
  number: 'HY-2026',
  unitSystem: 'SI' as const,
  /** Bottom to top. */
  levels: ['L1', 'L2', 'L3', 'L4', 'L5', 'Roof'],
};
