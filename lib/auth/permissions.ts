// The role × action matrix: the one table that says who may do what. Pure data, safe on the client
// (navigation hides what a role cannot do); the server enforces it through lib/auth/access.ts.
import { labelled } from '@/lib/labelled';

export const { values: roles, labels: roleLabels } = labelled({ admin: 'Admin', office: 'Office', technician: 'Technician', client: 'Owner' });
export type Role = (typeof roles)[number];

const staff: Role[] = ['admin', 'office', 'technician'];
const everyone: Role[] = ['admin', 'office', 'technician', 'client'];
const officeUp: Role[] = ['admin', 'office'];

export const permissions = {
  'clients.read': everyone,
  'clients.write': officeUp,
  'contacts.read': staff,
  'contacts.write': officeUp,
  'sites.read': everyone,
  'sites.write': officeUp,
  'areas.read': everyone,
  'areas.write': officeUp,
  'users.manage': ['admin'],
  'company.settings': ['admin'],
  'profile.update': everyone,
  'audit.read': officeUp,
  'mail.inbox': ['admin'],
  'calc.use': everyone,
  'systems.read': everyone,
  'systems.write': officeUp,
  'equipment.read': everyone,
  'equipment.write': staff,
  'equipment.delete': officeUp,
  'equipment.import': officeUp,
  // Photos: everyone reads within their scope; a technician may change or delete their own uploads.
  'photos.read': everyone,
  'photos.upload': staff,
  'photos.manage': officeUp,
  'photos.maintain': ['admin'],
  'tags.scan': everyone,
  'tags.claim': staff,
  'tags.print': officeUp,
  'visits.read': everyone,
  'visits.start': staff,
  'visits.review': officeUp,
  'entries.write': staff,
  'followups.read': everyone,
  'followups.write': staff,
  'requests.create': ['admin', 'office', 'client'],
  'requests.read': everyone,
  'requests.manage': officeUp,
  'reports.read': everyone,
  'overview.read': everyone,
  'due.read': officeUp,
  // Planned visits: the office plans, moves and cancels; everyone reads within their scope
  // (technicians their company's, owners their own sites').
  'plans.read': everyone,
  'plans.write': officeUp,
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof permissions;

export function roleCan(role: Role, permission: Permission): boolean {
  return (permissions[permission] as readonly Role[]).includes(role);
}
