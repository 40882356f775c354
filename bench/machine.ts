/** The machine a benchmark ran on, from Node's os module. */
import os from 'node:os';

export interface Machine {
  readonly cpu: string;
  readonly cores: number;
  readonly memoryGiB: number;
  readonly node: string;
  readonly platform: string;
  /** 1-minute load average when asked: the figures are only as steady as the machine was quiet */
  readonly load: number;
}

export function machine(): Machine {
  const cpus = os.cpus();
  return {
    cpu: cpus[0]?.model.trim() ?? 'unknown CPU',
    cores: typeof os.availableParallelism === 'function' ? os.availableParallelism() : cpus.length,
    memoryGiB: Math.round(os.totalmem() / 2 ** 30),
    node: process.version,
    platform: `${os.platform()} ${os.release()} ${os.arch()}`,
    load: os.loadavg()[0] ?? NaN,
  };
}

export function describeMachine(m: Machine): string {
  return `${m.cpu}, ${m.cores} cores, ${m.memoryGiB} GiB, Node ${m.node}, ${m.platform}, load average ${m.load.toFixed(1)}`;
}
