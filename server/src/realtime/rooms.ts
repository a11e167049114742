// Room names, in one place: every user joins their organization's room and their own.
export const rooms = {
  organization: (organizationId: string) => `org:${organizationId}`,
  user: (userId: string) => `user:${userId}`,
  admins: () => 'admins',
};
