import type { RequestStatus, Urgency } from '@/lib/requests/schemas';

export interface ServiceRequestDto {
  id: string;
  siteId: string;
  siteName: string;
  clientName: string;
  equipmentId: string | null;
  equipmentName: string | null;
  requestedByName: string;
  description: string;
  urgency: Urgency;
  photoId: string | null;
  status: RequestStatus;
  officeNote: string | null;
  visitId: string | null;
  createdAt: string;
  updatedAt: string;
  /** The viewer may change its status, note and visit (office and admin): decided by the service. */
  canManage: boolean;
}
