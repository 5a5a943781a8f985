import type { Role } from '@/lib/auth/permissions';

// The signed-in person as every service sees them. Re-read from the database on each request,
// so a role change or deactivation takes effect at once.
export interface Actor {
  id: string;
  companyId: string;
  role: Role;
  clientId: string | null;
  name: string;
  email: string;
  units: 'imperial' | 'metric';
  metricPressure: 'kPa' | 'bar';
}

/** The columns of a `users` row that make an Actor. */
export interface ActorRow {
  id: string;
  company_id: string;
  role: string;
  client_id: string | null;
  name: string;
  email: string;
  units: string;
  metric_pressure: string;
}

export function actorFromRow(row: ActorRow): Actor {
  return {
    id: row.id,
    companyId: row.company_id,
    role: row.role as Role,
    clientId: row.client_id,
    name: row.name,
    email: row.email,
    units: row.units as Actor['units'],
    metricPressure: row.metric_pressure as Actor['metricPressure'],
  };
}
