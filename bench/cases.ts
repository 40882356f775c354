/** What each benchmark figure measures, its target and the accuracy it was taken at. */
export interface Figure {
  readonly name: string;
  /** the median, in `unit` */
  readonly value: number;
  readonly unit: 'ms' | 'per s';
  readonly target: number;
  /** 'max': value ≤ target passes; 'min': value ≥ target passes */
  readonly sense: 'max' | 'min';
  readonly accuracy: string;
  readonly note?: string;
}

export function passes(f: Figure): boolean {
  return f.sense === 'max' ? f.value <= f.target : f.value >= f.target;
}
