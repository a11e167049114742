// One line of set-up progress on stderr, prefixed so it stands out from the server's log.
export function log(message) {
  process.stderr.write(`[pollenpact] ${message}\n`);
}
