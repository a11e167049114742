// `npm run db:down`: stops the private database cluster.
import { ensurePostgresInstalled } from './lib/system-packages.mjs';
import { clusterDir, stopCluster } from './lib/postgres-cluster.mjs';
stopCluster({ bin: ensurePostgresInstalled(), dir: clusterDir() });
