// The mail catcher (maildev from node_modules), bound to 127.0.0.1 only.
import fs from 'node:fs';
import path from 'node:path';
import { ROOT, SetupError, childEnv, httpAnswers, log, startService, stopService, tailFile, waitFor } from './proc.mjs';

export const mailPorts = () => ({
  smtpPort: Number(process.env.KERFLINE_SMTP_PORT || 1025),
  webPort: Number(process.env.KERFLINE_MAIL_WEB_PORT || 1080),
});

// Overridable so that two checkouts on one machine can run their test suites side by side.
export const TEST_MAIL_PORTS = {
  smtpPort: Number(process.env.KERFLINE_TEST_SMTP_PORT || 1026),
  webPort: Number(process.env.KERFLINE_TEST_MAIL_WEB_PORT || 1081),
};

function maildevBin(root) {
  const dir = path.join(root, 'node_modules', 'maildev');
  const pkg = JSON.parse(fs.readFileSync(path.join(dir, 'package.json'), 'utf8'));
  const bin = typeof pkg.bin === 'string' ? pkg.bin : pkg.bin?.maildev;
  if (!bin) throw new SetupError('node_modules/maildev has no maildev bin');
  return path.join(dir, bin);
}

/** True when a maildev web API answers on `webPort` (GET /api/email returns a JSON array). */
export async function maildevAnswers(webPort) {
  const response = await httpAnswers(`http://127.0.0.1:${webPort}/api/email`);
  if (!response || response.status !== 200) return false;
  return (response.headers.get('content-type') ?? '').includes('json');
}

/**
 * Starts maildev unless one already answers on the web port (then reuses it and never stops it).
 * Resolves { webUrl, smtpUrl, started, stop }.
 */
export async function ensureMaildev({ smtpPort, webPort, logFile, root = ROOT }) {
  const webUrl = `http://127.0.0.1:${webPort}`;
  const smtpUrl = `smtp://127.0.0.1:${smtpPort}`;
  if (await maildevAnswers(webPort)) {
    log(`reusing the mail catcher already running at ${webUrl}`);
    return { webUrl, smtpUrl, started: false, stop: async () => {} };
  }
  if (await httpAnswers(`${webUrl}/`)) {
    throw new SetupError(`port ${webPort} is taken by something that is not maildev; set KERFLINE_MAIL_WEB_PORT`);
  }
  const args = ['--ip', '127.0.0.1', '--web-ip', '127.0.0.1', '-s', String(smtpPort), '-w', String(webPort)];
  // MAILDEV_* variables in the environment would override the flags' intent.
  const env = childEnv(Object.fromEntries(Object.keys(process.env).filter((k) => k.startsWith('MAILDEV_')).map((k) => [k, undefined])));
  const service = startService('maildev', process.execPath, [maildevBin(root), ...args], { env, logFile, cwd: root });
  const up = await waitFor(() => maildevAnswers(webPort), { timeoutMs: 30_000, abort: () => service.exited });
  if (!up) {
    await stopService(service, 2000);
    throw new SetupError(`maildev did not come up on ${webUrl}${logFile ? `. Log ${logFile}:\n${tailFile(logFile)}` : ''}`);
  }
  return { webUrl, smtpUrl, started: true, service, stop: () => stopService(service, 5000) };
}
