// The files an install copies from deploy/: the settings example must start a production server
// behind its proxy, and the systemd unit must run what the repository has.
import assert from 'node:assert/strict';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { ConfigError, loadConfig } from '../../server/config.ts';
import { REPO_ROOT } from '../helpers/run-larder.ts';

const DEPLOY = path.join(REPO_ROOT, 'deploy');

/** KEY=VALUE lines, as systemd's EnvironmentFile reads them; comments and blanks skipped. */
function environmentFile(text: string): Record<string, string> {
  const env: Record<string, string> = {};
  for (const line of text.split('\n')) {
    const match = /^([A-Z_]+)=(.*)$/.exec(line.trim());
    if (match) env[match[1]] = match[2];
  }
  return env;
}

/** `Key=value` settings of a unit file (the last one wins, as in systemd). */
function unitSettings(text: string): Map<string, string> {
  const settings = new Map<string, string>();
  for (const line of text.split('\n')) {
    const match = /^([A-Za-z]+)=(.*)$/.exec(line.trim());
    if (match) settings.set(match[1], match[2]);
  }
  return settings;
}

describe('the deploy files', () => {
  const env = environmentFile(readFileSync(path.join(DEPLOY, 'larderbook.env.example'), 'utf8'));
  const unit = unitSettings(readFileSync(path.join(DEPLOY, 'larderbook.service'), 'utf8'));

  it('should hold settings a production server starts with, Secure cookies behind its proxy', () => {
    const config = loadConfig(env);
    assert.equal(config.mode, 'production');
    assert.equal(config.httpsOnly, true);
    assert.equal(config.trustProxy, 'loopback');
    assert.equal(config.dataDir, '/var/lib/larderbook');
  });

  it('should not start without the proxy setting at its https address', () => {
    const { LARDER_TRUST_PROXY: _proxy, ...withoutProxy } = env;
    assert.throws(() => loadConfig(withoutProxy), ConfigError);
  });

  it('should run the start script the repository has, restart it, and let it write its data', () => {
    const [node, script] = (unit.get('ExecStart') ?? '').split(' ');
    assert.equal(node, '/usr/bin/node');
    assert.ok(existsSync(path.join(REPO_ROOT, script)), `${script} is in the repository`);
    assert.equal(unit.get('Restart'), 'always');
    // The server exits 2 on a settings error (server/main.ts): restarting cannot mend that.
    assert.equal(unit.get('RestartPreventExitStatus'), '2');
    assert.equal(unit.get('EnvironmentFile'), '/etc/larderbook.env');
    assert.ok((unit.get('ReadWritePaths') ?? '').split(' ').includes(env.LARDER_DATA));
  });
});
