/**
 * The demo scenario: invented for the demo only (fictional contractor, people and sites).
 * Every demo sign-in uses the password below.
 */
export const DEMO_PASSWORD = 'plummet-demo';

export const DEMO_ORGANISATIONS = [
  { slug: 'harrow-span', name: 'Harrow & Span Access Ltd' },
  { slug: 'other-build', name: 'Otherbuild Contracting' },
] as const;

export const DEMO_USERS = [
  { email: 'admin@demo.test', name: 'Priya Okafor', position: 'Safety systems administrator', org: 'harrow-span', role: 'admin' },
  { email: 'manager@demo.test', name: 'Tomasz Reid', position: 'Site safety manager', org: 'harrow-span', role: 'manager' },
  { email: 'inspector@demo.test', name: 'Aileen Marsh', position: 'Scaffold inspector (advanced)', org: 'harrow-span', role: 'inspector' },
  { email: 'foreman@demo.test', name: 'Dev Castellano', position: 'Scaffolding foreman', org: 'harrow-span', role: 'foreman' },
  { email: 'manager@other.test', name: 'Ruth Lindqvist', position: 'Project manager', org: 'other-build', role: 'manager' },
] as const;
