/**
 * The local cluster's load balancer: Debian's nginx with its own configuration, pid file, logs
 * and temporary folders under `.data/cluster/nginx/` (never the system's nginx.conf). Requests go
 * round-robin to the Speedwright instances; a request that fails to connect or times out is
 * tried on the next instance when it is idempotent (nginx's default for `proxy_next_upstream`
 * since 1.9.13: never a POST, PATCH or LOCK sent once already), as nginx's ngx_http_proxy_module
 * documentation describes.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, openSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { findProgram } from '../instance';
import type { ClusterLayout } from './cluster-layout';
import { isAlive } from './galera-node';

const sleep = (ms: number) => new Promise((done) => setTimeout(done, ms));

export function nginxConfig(layout: ClusterLayout): string {
  const dir = layout.nginxDir;
  const servers = layout.apps.map((app) => `    server 127.0.0.1:${app.port} max_fails=1 fail_timeout=5s;`).join('\n');
  return `# The local cluster's load balancer; made by db/cluster/load-balancer.ts.
daemon off;
master_process on;
worker_processes 1;
pid ${join(dir, 'nginx.pid')};
error_log ${join(dir, 'error.log')} warn;
events { worker_connections 1024; }
http {
  access_log ${join(dir, 'access.log')};
  client_body_temp_path ${join(dir, 'tmp', 'body')};
  proxy_temp_path ${join(dir, 'tmp', 'proxy')};
  fastcgi_temp_path ${join(dir, 'tmp', 'fastcgi')};
  uwsgi_temp_path ${join(dir, 'tmp', 'uwsgi')};
  scgi_temp_path ${join(dir, 'tmp', 'scgi')};
  client_max_body_size 20m;
  upstream speedwright {
${servers}
    keepalive 16;
  }
  server {
    listen 127.0.0.1:${layout.balancerPort};
    location / {
      proxy_pass http://speedwright;
      proxy_http_version 1.1;
      proxy_set_header Connection "";
      proxy_set_header Host $http_host;
      proxy_set_header X-Forwarded-For $proxy_add_x_forwarded_for;
      proxy_set_header X-Forwarded-Proto $scheme;
      proxy_connect_timeout 2s;
      proxy_read_timeout 30s;
      # Idempotent requests only (nginx's default): a POST is never sent to a second instance.
      proxy_next_upstream error timeout http_502 http_503;
      proxy_next_upstream_tries 3;
      add_header X-Speedwright-Upstream $upstream_addr always;
    }
  }
}
`;
}

function nginxPid(layout: ClusterLayout): number | undefined {
  const file = join(layout.nginxDir, 'nginx.pid');
  if (!existsSync(file)) return undefined;
  const pid = Number.parseInt(readFileSync(file, 'utf8').trim(), 10);
  return Number.isInteger(pid) && pid > 0 && isAlive(pid) ? pid : undefined;
}

/** Starts nginx in the background (its master's pid in nginx.pid); checks the config first. */
export async function startLoadBalancer(layout: ClusterLayout): Promise<void> {
  if (nginxPid(layout)) return;
  const nginx = findProgram('nginx');
  if (!nginx) throw new Error('nginx is not installed (Debian package nginx).');
  for (const sub of ['body', 'proxy', 'fastcgi', 'uwsgi', 'scgi']) mkdirSync(join(layout.nginxDir, 'tmp', sub), { recursive: true });
  const configFile = join(layout.nginxDir, 'nginx.conf');
  writeFileSync(configFile, nginxConfig(layout));
  // -e: the early error log (before the config is read) goes here too, not to /var/log/nginx.
  const base = ['-p', layout.nginxDir, '-e', join(layout.nginxDir, 'error.log'), '-c', configFile];
  const test = spawnSync(nginx, [...base, '-t'], { encoding: 'utf8' });
  if (test.status !== 0) throw new Error(`nginx refuses its configuration: ${test.stderr}`);
  const logFd = openSync(join(layout.nginxDir, 'nginx.out'), 'a');
  spawn(nginx, base, { detached: true, stdio: ['ignore', logFd, logFd] }).unref();
  const deadline = Date.now() + 10_000;
  while (Date.now() < deadline) {
    if (nginxPid(layout)) return;
    await sleep(100);
  }
  throw new Error(`nginx did not start; see ${join(layout.nginxDir, 'error.log')}.`);
}

export async function stopLoadBalancer(layout: ClusterLayout): Promise<boolean> {
  const pid = nginxPid(layout);
  if (!pid) return false;
  process.kill(pid, 'SIGQUIT');
  const deadline = Date.now() + 10_000;
  while (isAlive(pid) && Date.now() < deadline) await sleep(100);
  if (isAlive(pid)) process.kill(pid, 'SIGKILL');
  return true;
}
