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
