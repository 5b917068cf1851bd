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
  if (role === 'licensee') {
    items.push({ label: 'Portal', icon: 'storefront', link: '/portal' }, { label: 'My stocks', icon: 'set_meal', link: '/stocks' });
    return items;
  }
  items.push({ label: 'Stocks', icon: 'set_meal', link: '/stocks' });
  if (role === 'board' || role === 'admin') items.push({ label: 'Board', icon: 'how_to_vote', link: '/board' });
  items.push({ label: 'Advisories', icon: 'description', link: '/advisories' });
  if (role === 'admin') items.push({ label: 'People', icon: 'manage_accounts', link: '/admin/users' }, { label: 'Mail', icon: 'outgoing_mail', link: '/admin/mail' });
  return items;
}
