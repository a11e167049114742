// Starts the local stand-ins for hosted services on their configured ports (npm start, npm run dev).
import { loadConfig } from '../config/env.js';
import { startSmtpSink } from './smtp-sink.js';

const config = loadConfig();
const sink = await startSmtpSink({ smtpPort: config.mail.port, httpPort: Number(new URL(config.mail.sinkUrl).port) });
process.stderr.write(`[pollenpact] e-mail sink: SMTP 127.0.0.1:${sink.smtpPort}, messages at ${config.mail.sinkUrl}/messages\n`);

const stop = async () => {
  await sink.stop();
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
