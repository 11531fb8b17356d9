import type { Role } from '../shared/domain';

/**
 * The demo sign-ins: one per role plus an administrator. Invented people at a reserved
 * example domain; `npm start` prints this list and the README repeats it. Demo only:
 * a real deployment invites its people instead.
 */
export interface DemoAccount {
  role: Role;
  isAdmin: boolean;
  email: string;
  password: string;
  displayName: string;
  phone: string;
  note: string;
  /** What to look at first after signing in (the start banner prints it). */
  lookFirst: string;
}

export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  {
    role: 'manager',
    isAdmin: true,
    email: 'morgan.ashby@lindenfield.example.com',
    password: 'frosty-admin-2026',
    displayName: 'Morgan Ashby',
    phone: '555-0142',
    note: 'administrator: also manages users',
    lookFirst: 'People: invite a tenant (the invitation lands in the fake inbox); Reports: repair costs of the last three months',
  },
  {
    role: 'manager',
    isAdmin: false,
    email: 'dana.whitcombe@lindenfield.example.com',
    password: 'frosty-manager-2026',
    displayName: 'Dana Whitcombe',
    phone: '555-0143',
    note: 'property manager',
    lookFirst: 'Fleet: 304 at Harrowgate Commons turns warm, 3B at The Ostler Building drifts; Work orders: the urgent job; Incidents: the power loss at Bramblewick Row',
  },
  {
    role: 'contractor',
    isAdmin: false,
    email: 'eli.rook@rook-repair.example.com',
    password: 'frosty-contractor-2026',
    displayName: 'Eli Rook (Rook Appliance Repair, demo)',
    phone: '555-0188',
    note: 'repair technician',
    lookFirst: 'My jobs: accept the urgent job at 304, Harrowgate Commons, record the fan motor and labour, complete it',
  },
  {
    role: 'tenant',
    isAdmin: false,
    email: 'jun.okafor@example.com',
    password: 'frosty-tenant-2026',
    displayName: 'Jun Okafor',
    phone: '555-0117',
    note: 'tenant of one unit',
    lookFirst: 'My refrigerator: the status of unit 304, the repair under way and what to do with the food',
  },
];
