// nginx from Debian as the reverse proxy in front of several app processes: a private configuration,
// pid and temp files under .data/<name>/nginx, run in the foreground as our child (never the system nginx).
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, mkdirSync, writeFileSync } from 'node:fs'
import net from 'node:net'
import path from 'node:path'
import { dataRoot } from './embeddedMariadb.js'

export interface NginxProxy { url: string; port: number; stop(): Promise<void> }

export function nginxBinary(): string {
  const found = ['/usr/sbin/nginx', '/usr/bin/nginx'].find((p) => existsSync(p))
  if (!found) throw new Error('nginx is missing: sudo apt-get install -y nginx (npm run test:faults installs it when run as root)')
  return found
}

export async function startNginx(name: string, port: number, upstreams: string[]): Promise<NginxProxy> {
  const dir = path.join(dataRoot, name, 'nginx')
  mkdirSync(path.join(dir, 'tmp'), { recursive: true })
  const asRoot = process.getuid?.() === 0
  const conf = `${asRoot ? 'user root;\n' : ''}worker_processes 1;
pid ${dir}/nginx.pid;
error_log ${dir}/error.log warn;
events { worker_connections 512; }
http {
  access_log off;
  client_body_temp_path ${dir}/tmp/body;
  proxy_temp_path ${dir}/tmp/proxy;
  fastcgi_temp_path ${dir}/tmp/fastcgi;
  uwsgi_temp_path ${dir}/tmp/uwsgi;
  scgi_temp_path ${dir}/tmp/scgi;
  upstream lumenyard {
${upstreams.map((u) => `    server ${u};`).join('\n')}
    keepalive 32;
  }
  server {
    listen 127.0.0.1:${port};
    client_max_body_size 12m;
    location / {
      proxy_pass http://lumenyard;
      proxy_http_version 1.1;
      proxy_set_header Connection "";
      proxy_set_header Host $http_host;
      proxy_set_header X-Forwarded-For $proxy_add_x_forwarded_for;
      proxy_set_header X-Forwarded-Proto $scheme;
      # A request that reached an app process is never sent to another (POSTs are not idempotent to nginx).
      proxy_next_upstream error timeout;
      proxy_read_timeout 120s;
    }
  }
}
`
  const file = path.join(dir, 'nginx.conf')
  writeFileSync(file, conf)
  const child: ChildProcess = spawn(nginxBinary(), ['-p', dir, '-c', file, '-g', 'daemon off;'], { stdio: ['ignore', 'ignore', 'pipe'] })
  const errors: string[] = []
  child.stderr!.on('data', (d: Buffer) => errors.push(d.toString()))
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()))
  for (let i = 0; i < 100; i++) {
    if (child.exitCode !== null) throw new Error(`nginx exited: ${errors.join('')}`)
    if (await answers(port)) break
    await new Promise((r) => setTimeout(r, 100))
    if (i === 99) throw new Error(`nginx did not listen on ${port}: ${errors.join('')}`)
  }
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    stop: async () => { if (child.exitCode === null) { child.kill('SIGQUIT'); await exited } },
  }
}

function answers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect({ host: '127.0.0.1', port })
    s.once('connect', () => { s.destroy(); resolve(true) })
    s.once('error', () => resolve(false))
  })
}
