import type { SessionUser } from '../../../../shared/api/session';
import { navSectionsFor } from './nav-items';

function user(overrides: Partial<SessionUser>): SessionUser {
  return {
    id: 'u1',
    email: 'someone@example.com',
    displayName: 'Someone',
    role: 'manager',
    isAdmin: false,
    organizationId: 'o1',
    unitId: null,
    temperatureUnit: 'F',
    timeZone: null,
    ...overrides,
  };
}

const pathsOf = (u: SessionUser | null) => navSectionsFor(u).flatMap((section) => section.items.map((item) => item.path));

describe('navSectionsFor', () => {
  it('offers a signed-out visitor only sign-in and the status page', () => {
    expect(pathsOf(null)).toEqual(['/sign-in', '/status']);
  });

  it('gives a manager the fleet, repair and management pages but not user management', () => {
    const paths = pathsOf(user({ role: 'manager' }));
    expect(paths).toContain('/fleet');
    expect(paths).toContain('/work-orders');
    expect(paths).toContain('/reports');
    expect(paths).not.toContain('/users');
  });

  it('adds user management for an admin manager', () => {
    expect(pathsOf(user({ role: 'manager', isAdmin: true }))).toContain('/users');
  });

  it('gives a contractor only their jobs and the status page', () => {
    expect(pathsOf(user({ role: 'contractor' }))).toEqual(['/jobs', '/status']);
  });

  it('gives a tenant only their own refrigerator', () => {
    expect(pathsOf(user({ role: 'tenant', unitId: 'unit-1' }))).toEqual(['/home']);
  });
});
