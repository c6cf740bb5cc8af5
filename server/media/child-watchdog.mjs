// Watches the server (or worker) that started it, through this process's stdin:
// the parent writes "+<pid>" when it starts an ffmpeg/ffprobe process group and
// "-<pid>" when that group has ended. When stdin closes, the parent is gone
// (exited or SIGKILLed), so every group still listed is killed. Plain Node,
// no dependencies: it must start even when the parent runs under a loader.
import { createInterface } from 'node:readline';

const groups = new Set();
const killAll = () => {
  for (const pid of groups) {
    try {
      process.kill(-pid, 'SIGKILL');
    } catch {
      // already gone
    }
  }
  groups.clear();
};

// Terminal signals go to the parent's group, not ours; the parent's end of the pipe is what counts.
process.on('SIGINT', () => {});
process.on('SIGHUP', () => {});
process.on('SIGTERM', () => {
  killAll();
  process.exit(0);
});

const lines = createInterface({ input: process.stdin });
lines.on('line', (line) => {
  const pid = Number(line.slice(1));
  if (!Number.isInteger(pid) || pid <= 1) return;
  if (line[0] === '+') groups.add(pid);
  else if (line[0] === '-') groups.delete(pid);
});
lines.on('close', () => {
  killAll();
  process.exit(0);
});
