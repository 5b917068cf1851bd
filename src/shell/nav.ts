import type { Role } from '../../api/users/user.schemas';

export interface NavItem {
  label: string;
  icon: string;
  link: string;
}

/** The main navigation for a role. */
export function navFor(role: Role | null): NavItem[] {
  if (role === null) return [];
  const items: NavItem[] = [{ label: 'Home', icon: 'home', link: '/' }];
  items.push({ label: role === 'licensee' ? 'My stocks' : 'Stocks', icon: 'set_meal', link: '/stocks' });
  if (role === 'admin') items.push({ label: 'People and roles', icon: 'manage_accounts', link: '/admin/users' });
  return items;
}
