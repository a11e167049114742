// Starts the local stand-ins for hosted services on their configured ports (npm start, npm run dev).
import { loadConfig } from '../config/env.js';
import { startSmtpSink } from './smtp-sink.js';
import { startPaymentsStandIn } from './payments-stand-in.js';

const config = loadConfig();
const sink = await startSmtpSink({ smtpPort: config.mail.port, httpPort: Number(new URL(config.mail.sinkUrl).port) });
process.stderr.write(`[pollenpact] e-mail sink: SMTP 127.0.0.1:${sink.smtpPort}, messages at ${config.mail.sinkUrl}/messages\n`);
const payments = await startPaymentsStandIn({ ...config.payments, port: Number(new URL(config.payments.apiUrl).port), webhookUrl: `${config.publicUrl}/api/webhooks/payments` });
process.stderr.write(`[pollenpact] payments stand-in: ${payments.url} (test payments only)\n`);

const stop = async () => {
  await sink.stop();
  await payments.stop();
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
