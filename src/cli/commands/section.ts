/**
 * `gvf section`: one cross-section, a discharge and a slope → normal and critical depth, slope class, and the
 * elements at normal depth (and at --depth). Thin: read the flags, call runSection, print.
 */
import { FlagReader, type SectionFlags, sectionFlagOf, sectionFromFlags, slopeAndDischarge, unitsFromFlag } from '../../input/model/flags.js';
import { sectionReport } from '../../output/table.js';
import { runSection } from '../../runSection.js';
import { type Streams, exitCode, toJson } from '../print.js';

export interface SectionOptions extends SectionFlags {
  units?: string;
  slope?: string;
  discharge?: string;
  depth?: string;
  json?: boolean;
}

export function sectionCommand(options: SectionOptions, streams: Streams): number {
  const reader = new FlagReader();
  const units = unitsFromFlag(reader, options.units);
  const section = sectionFromFlags(reader, options);
  const { slope, discharge } = slopeAndDischarge(reader, options);
  const depth = reader.number('--depth', options.depth, 'positive', false);
  reader.done();
  const result = runSection({
    section: section!,
    units,
    slope: slope!,
    discharge: discharge!,
    ...(depth === undefined ? {} : { depth }),
    whereOf: (key) => sectionFlagOf[key] ?? `--${key}`,
    depthWhere: '--depth',
  });
  streams.out(options.json ? toJson(result) : sectionReport(result));
  return exitCode.ok;
}
