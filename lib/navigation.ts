import type { Role } from '@/lib/auth/permissions';

export interface NavItem {
  href: string;
  label: string;
  icon: 'home' | 'scan' | 'sites' | 'equipment' | 'visits' | 'followUps' | 'tags' | 'clients' | 'settings' | 'gauge';
  roles: readonly Role[];
}

// Places are added here as they are built; nothing links to a page that does not exist yet.
export const navItems: NavItem[] = [
  { href: '/', label: 'Home', icon: 'home', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/scan', label: 'Scan', icon: 'scan', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/sites', label: 'Sites', icon: 'sites', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/equipment', label: 'Equipment', icon: 'equipment', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/visits', label: 'Visits', icon: 'visits', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/follow-ups', label: 'Follow-ups', icon: 'followUps', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/tools/pt-chart', label: 'P-T chart', icon: 'gauge', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/tags', label: 'Tags', icon: 'tags', roles: ['admin', 'office'] },
  { href: '/clients', label: 'Clients', icon: 'clients', roles: ['admin', 'office'] },
  { href: '/settings', label: 'Settings', icon: 'settings', roles: ['admin', 'office', 'technician', 'client'] },
];

export function navFor(role: Role): NavItem[] {
  return navItems.filter((i) => i.roles.includes(role));
}
