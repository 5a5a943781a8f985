import type { Role } from '@/lib/auth/permissions';

export interface UserDto {
  id: string;
  email: string;
  name: string;
  role: Role;
  clientId: string | null;
  clientName: string | null;
  active: boolean;
  lastSignInAt: string | null;
  createdAt: string;
}

export interface InvitationDto {
  id: string;
  email: string;
  name: string;
  role: Role;
  clientId: string | null;
  expiresAt: string;
  acceptedAt: string | null;
  revokedAt: string | null;
  createdAt: string;
}

export interface CompanyDto {
  id: string;
  name: string;
  servicePhone: string | null;
  labelLine: string | null;
  defaultUnits: 'imperial' | 'metric';
  keepPhotoLocation: boolean;
  mailVisitPlans: boolean;
}
