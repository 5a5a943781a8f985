import type { Role } from '@/lib/auth/permissions';

export interface NavItem {
  href: string;
  label: string;
  icon: 'home' | 'scan' | 'sites' | 'equipment' | 'visits' | 'followUps' | 'tags' | 'clients' | 'settings' | 'gauge' | 'requests' | 'reports' | 'plans';
  /** Shown in the phone's always-visible row; the rest sit behind "More". */
  primary?: boolean;
  roles: readonly Role[];
}

// Places are added here as they are built; nothing links to a page that does not exist yet.
export const navItems: NavItem[] = [
  { href: '/', label: 'Home', icon: 'home', roles: ['admin', 'office', 'technician', 'client'], primary: true },
  { href: '/scan', label: 'Scan', icon: 'scan', roles: ['admin', 'office', 'technician', 'client'], primary: true },
  { href: '/sites', label: 'Sites', icon: 'sites', roles: ['admin', 'office', 'technician', 'client'], primary: true },
  { href: '/equipment', label: 'Equipment', icon: 'equipment', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/visits', label: 'Visits', icon: 'visits', roles: ['admin', 'office', 'technician', 'client'], primary: true },
  { href: '/plans', label: 'Planned visits', icon: 'plans', roles: ['admin', 'office', 'technician'] },
  { href: '/follow-ups', label: 'Follow-ups', icon: 'followUps', roles: ['admin', 'office', 'technician', 'client'] },
  { href: '/requests', label: 'Requests', icon: 'requests', roles: ['admin', 'office', 'client'] },
  { href: '/reports', label: 'Reports', icon: 'reports', roles: ['admin', 'office', 'technician', 'client'] },
  // A trade tool: owners do not read pressure–temperature tables, so it is not in their menu.
  { href: '/tools/pt-chart', label: 'P-T chart', icon: 'gauge', roles: ['admin', 'office', 'technician'] },
  { href: '/tags', label: 'Tags', icon: 'tags', roles: ['admin', 'office'] },
  { href: '/clients', label: 'Clients', icon: 'clients', roles: ['admin', 'office'] },
  { href: '/settings', label: 'Settings', icon: 'settings', roles: ['admin', 'office', 'technician', 'client'] },
];

export function navFor(role: Role): NavItem[] {
  return navItems.filter((i) => i.roles.includes(role));
}
