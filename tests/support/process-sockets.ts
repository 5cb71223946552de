import fs from 'node:fs';

/** Pids of the processes whose parent is `pid` (a primary's web workers, its PostgreSQL). */
export function childrenOf(pid: number): number[] {
  return fs
    .readdirSync('/proc')
    .filter((entry) => /^\d+$/.test(entry))
    .filter((entry) => {
      try {
        // Field 4 of /proc/<pid>/stat is the parent pid; the name in field 2 may hold spaces, so count from its ')'.
        const stat = fs.readFileSync(`/proc/${entry}/stat`, 'utf8');
        return Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]) === pid;
      } catch {
        return false;
      }
    })
    .map(Number);
}

/**
 * How many IPv4 TCP connections open in process `pid` match `which` (given the local and remote
 * port): the process's socket inodes (/proc/<pid>/fd) matched with /proc/<pid>/net/tcp (proc(5):
 * local and remote address as hex ip:port in columns 2 and 3, state in 4, inode in 10). Only
 * established connections (state 01) count.
 */
export function tcpConnectionsOf(pid: number, which: (localPort: number, remotePort: number) => boolean): number {
  const inodes = new Set<string>();
  for (const fd of fs.readdirSync(`/proc/${pid}/fd`)) {
    try {
      const inode = /^socket:\[(\d+)\]$/.exec(fs.readlinkSync(`/proc/${pid}/fd/${fd}`))?.[1];
      if (inode) inodes.add(inode);
    } catch {
      // Closed while being read.
    }
  }
  const portOf = (address: string) => parseInt(address.split(':')[1]!, 16);
  return fs
    .readFileSync(`/proc/${pid}/net/tcp`, 'utf8')
    .split('\n')
    .slice(1)
    .map((line) => line.trim().split(/\s+/))
    .filter((fields) => fields.length > 9 && fields[3] === '01' && inodes.has(fields[9]!))
    .filter((fields) => which(portOf(fields[1]!), portOf(fields[2]!))).length;
}
