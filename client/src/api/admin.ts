// The platform admin's read-only views.
import { http } from './http';
import type { AdminEmail, AdminOrganization, AdminQueueHealth, AdminUser } from '@shared/schemas/dashboard';

export const adminApi = {
  organizations: () => http.get<{ organizations: AdminOrganization[] }>('/admin/organizations'),
  users: () => http.get<{ users: AdminUser[] }>('/admin/users'),
  emails: () => http.get<{ emails: AdminEmail[] }>('/admin/emails'),
  queues: () => http.get<AdminQueueHealth>('/admin/queues'),
};
