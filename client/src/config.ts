// The client's configuration: the only reader of import.meta.env.
export const clientConfig = {
  apiBase: (import.meta.env.VITE_API_BASE as string | undefined) ?? '/api',
  appName: 'Pollenpact',
};
