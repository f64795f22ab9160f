/**
 * The invented demo lab (local demo only: these passwords are public). scripts/seed-demo.ts
 * creates it; tests import the same list.
 */
import type { Role } from '@/lib/auth/permissions';

export interface DemoPerson {
  role: Role;
  name: string;
  email: string;
  password: string;
  group: string;
}

export interface DemoGroup {
  slug: string;
  name: string;
}

export const demoGroups: DemoGroup[] = [
  { slug: 'kestrel-ridge', name: 'Kestrel Ridge Phonon Group (invented)' },
  { slug: 'ashgrove', name: 'Ashgrove Materials Theory (invented)' },
];

export const demoPeople: DemoPerson[] = [
  { role: 'admin', name: 'Noor Valdecasas', email: 'noor@kestrel-ridge.example', password: 'kestrel-admin-demo', group: 'kestrel-ridge' },
  { role: 'reviewer', name: 'Tobias Lindqvist', email: 'tobias@kestrel-ridge.example', password: 'kestrel-reviewer-demo', group: 'kestrel-ridge' },
  { role: 'submitter', name: 'Priya Okafor', email: 'priya@kestrel-ridge.example', password: 'kestrel-submitter-demo', group: 'kestrel-ridge' },
  { role: 'observer', name: 'Matteo Sørbye', email: 'matteo@kestrel-ridge.example', password: 'kestrel-observer-demo', group: 'kestrel-ridge' },
  // A second group, so that the demo can show that other groups' pages are a 404.
  { role: 'admin', name: 'Lena Duarte', email: 'lena@ashgrove.example', password: 'ashgrove-admin-demo', group: 'ashgrove' },
];

export function demoSignInTable(people: DemoPerson[] = demoPeople): string {
  const rows = people.map((p) => `| ${p.role} | ${p.email} | ${p.password} |`);
  return [
    'Demo sign-ins (local demo only; invented people, public passwords):',
    '',
    '| Role | E-mail | Password |',
    '|---|---|---|',
    ...rows,
  ].join('\n');
}
