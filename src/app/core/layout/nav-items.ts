import type { SessionUser } from '../../../../shared/api/session';

export interface NavItem {
  label: string;
  icon: string;
  path: string;
}

export interface NavSection {
  title: string | null;
  items: NavItem[];
}

const MANAGER_SECTIONS: NavSection[] = [
  {
    title: 'Watch',
    items: [
      { label: 'Fleet', icon: 'kitchen', path: '/fleet' },
      { label: 'Incidents', icon: 'device_thermostat', path: '/incidents' },
    ],
  },
  {
    title: 'Repair',
    items: [
      { label: 'Service requests', icon: 'assignment', path: '/requests' },
      { label: 'Work orders', icon: 'build', path: '/work-orders' },
    ],
  },
  {
    title: 'Manage',
    items: [
      { label: 'Inventory', icon: 'apartment', path: '/inventory' },
      { label: 'Logger files', icon: 'upload_file', path: '/logger-files' },
      { label: 'Reports', icon: 'insights', path: '/reports' },
      { label: 'Settings', icon: 'tune', path: '/settings' },
    ],
  },
];

const ADMIN_ITEM: NavItem = { label: 'People', icon: 'group', path: '/users' };
const STATUS_ITEM: NavItem = { label: 'System status', icon: 'monitor_heart', path: '/status' };

/** The navigation a person sees; the server enforces access, this only avoids dead ends. */
export function navSectionsFor(user: SessionUser | null): NavSection[] {
  if (!user) return [{ title: null, items: [{ label: 'Sign in', icon: 'login', path: '/sign-in' }, STATUS_ITEM] }];
  switch (user.role) {
    case 'manager': {
      const admin = user.isAdmin ? [ADMIN_ITEM] : [];
      return [...MANAGER_SECTIONS, { title: 'System', items: [...admin, STATUS_ITEM] }];
    }
    case 'contractor':
      return [{ title: null, items: [{ label: 'My jobs', icon: 'handyman', path: '/jobs' }, STATUS_ITEM] }];
    case 'tenant':
      return [{ title: null, items: [{ label: 'My refrigerator', icon: 'kitchen', path: '/home' }] }];
  }
}
