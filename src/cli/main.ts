#!/usr/bin/env node
/**
 * The gvf command line. Thin: commander reads the flags, each command module calls the library and prints.
 * Command modules are imported when their command runs, so `gvf section` never loads the schema library
 * or the charting stack (cold start matters for scripted use).
 */
import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Command, CommanderError, Option } from 'commander';
import { programVersion as version } from '../core/version.js';
import { helpAfterError } from '../input/model/messages.js';
import { type Streams, exitCode, processStreams, reportError } from './print.js';

function sectionOptions(command: Command): Command {
  return command
    .addOption(new Option('--shape <shape>', 'section shape').choices(['rectangular', 'trapezoidal', 'triangular', 'circular']))
    .option('--bottom-width <B>', 'bottom width (rectangular, trapezoidal)')
    .option('--side-slope <Z>', 'side slope, horizontal : 1 vertical (trapezoidal, triangular; both sides unless --side-slope-right)')
    .option('--side-slope-right <Z2>', 'right side slope, horizontal : 1 vertical')
    .option('--diameter <D>', 'diameter (circular conduit)')
    .option('--n <n>', "Manning's n (0.005–0.2 unless --force)")
    .option('--chezy <C>', 'Chézy C in the unit system\'s units (with --friction chezy)')
    .option('--ks <ks>', 'equivalent sand roughness ks, a length (with --friction darcy-weisbach; Colebrook–White)')
    .addOption(new Option('--friction <law>', 'friction law (default: from the roughness given)').choices(['manning', 'chezy', 'darcy-weisbach']))
    .option('--alpha <A>', 'fixed kinetic-energy coefficient α (default from the section, 1 for one roughness)')
    .option('--slope <S>', 'bed slope as a fraction (0.001 = 0.1 %)')
    .option('--discharge <Q>', 'discharge')
    .option('--units <system>', 'SI (m, m³/s) or US (ft, ft³/s)', 'SI')
    .option('--force', 'accept a roughness outside the usual range');
}

/** Build the program; `streams` receive all output (tests pass their own). */
export function buildProgram(streams: Streams, setCode: (code: number) => void): Command {
  const program = new Command('gvf')
    .description('Gradually varied flow in open channels: normal and critical depth, water-surface profiles, jumps.')
    .version(version, '-v, --version')
    .exitOverride()
    .configureOutput({ writeOut: (s) => streams.out(s), writeErr: (s) => streams.err(s.trimEnd()) })
    .showHelpAfterError(helpAfterError);

  sectionOptions(program.command('section'))
    .description('normal and critical depth, slope class and flow elements of one cross-section')
    .option('--depth <Y>', 'also report every element at this depth')
    .option('--json', 'print one JSON object')
    .action(async (options) => {
      const { sectionCommand } = await import('./commands/section.js');
      setCode(sectionCommand(options, streams));
    });

  sectionOptions(program.command('profile'))
    .description('water-surface profile along one prismatic reach')
    .option('--length <L>', 'reach length')
    .option('--upstream <control>', 'upstream control: normal, critical, or a depth')
    .option('--downstream <control>', 'downstream control: normal, critical, or a depth')
    .addOption(new Option('--method <method>', 'integration method').choices(['standard-step', 'direct-step', 'ode']))
    .addOption(
      new Option('--friction-averaging <mean>', 'friction-slope averaging of the standard step').choices([
        'conveyance',
        'arithmetic',
        'geometric',
        'harmonic',
      ]),
    )
    .option('--step <dx>', 'output spacing (default at most 1/100 of the length)')
    .option('--compare', 'run all three methods and report the largest difference')
    .option('--json', 'print the result as JSON')
    .option('--csv <file>', 'write the station table to a CSV file')
    .action(async (options) => {
      const { profileCommand } = await import('./commands/profile.js');
      setCode(await profileCommand(options, streams));
    });

  program
    .command('run')
    .description('compute every flow of a model file (JSON; see schema/gvf-model.schema.json)')
    .argument('<model>', 'model file')
    .addOption(new Option('--method <method>', 'integration method (overrides the model)').choices(['standard-step', 'direct-step', 'ode']))
    .option('--step <dx>', 'output spacing (overrides the model)')
    .option('--compare', 'run all three methods and report the largest difference')
    .option('--json', 'print the result as JSON')
    .option('--csv <file>', 'write the station table to a CSV file')
    .option('--force', 'accept a roughness outside the usual range')
    .option('--allow-outside', "let a model's survey files lie outside the model's folder (only for a model you trust)")
    .option('--no-interpolate', 'do not insert interpolated sections between surveyed ones (the accuracy goal is then not checked)')
    .option('--out <dir>', 'write report.html, result.json, stations.csv and charts/ into this folder')
    .option('--sections <stations>', "with --out: cross-section charts at these stations (comma-separated; replaces the model's sectionChartsAt)")
    .option('--energy-at <station>', 'with --out: the specific-energy and specific-force diagram at this station')
    .option('--energy-flow <id>', 'with --out: the flow of that diagram (default: the first flow)')
    .option('--flows <file>', 'CSV of flows (id, discharge[, downstream stage]) replacing the model\'s flows')
    .option('--sensitivity <list>', 'also run varied cases, e.g. n=±20%,Q=±10%, and report the range of water surface')
    .action(async (model: string, options) => {
      const { runCommand } = await import('./commands/run.js');
      setCode(await runCommand(model, options, streams));
    });

  program
    .command('calibrate')
    .description('fit roughness multipliers to observed high-water marks (bounded least squares)')
    .argument('<model>', 'model file')
    .option('--marks <file>', 'CSV of high-water marks: station, elevation, flow id[, weight]')
    .option('--per-reach', 'one multiplier per reach (default: one for the whole model)')
    .option('--bounds <lower:upper>', 'bounds of each multiplier (default 0.5:2)')
    .addOption(new Option('--method <method>', 'integration method (overrides the model)').choices(['standard-step', 'direct-step', 'ode']))
    .option('--step <dx>', 'output spacing (overrides the model)')
    .option('--json', 'print the result as JSON')
    .option('--csv <file>', 'write the mark table (residuals) to a CSV file')
    .option('--out <dir>', 'write calibration.json, marks.csv and the chart of marks and calibrated profile')
    .option('--force', 'accept a roughness outside the usual range')
    .option('--allow-outside', 'let surveyed reaches read files outside the model folder')
    .option('--no-interpolate', 'do not insert interpolated sections between surveyed ones')
    .action(async (model: string, options) => {
      const { calibrateCommand } = await import('./commands/calibrate.js');
      setCode(await calibrateCommand(model, options, streams));
    });

  program
    .command('rating')
    .description('stage and velocity at chosen stations for a list or range of discharges')
    .argument('<model>', 'model file')
    .option('--stations <list>', 'stations, comma-separated (e.g. 120,480)')
    .option('--discharges <list>', 'discharges: a list 2,5,10 or a range from:to:step such as 1:20:1')
    .addOption(new Option('--method <method>', 'integration method (overrides the model)').choices(['standard-step', 'direct-step', 'ode']))
    .option('--step <dx>', 'output spacing (overrides the model)')
    .option('--json', 'print the result as JSON')
    .option('--csv <file>', 'write the rating table to a CSV file')
    .option('--out <dir>', 'write rating.json, rating.csv and the rating-curve chart')
    .option('--force', 'accept a roughness outside the usual range')
    .option('--allow-outside', 'let surveyed reaches read files outside the model folder')
    .option('--no-interpolate', 'do not insert interpolated sections between surveyed ones')
    .action(async (model: string, options) => {
      const { ratingCommand } = await import('./commands/rating.js');
      setCode(await ratingCommand(model, options, streams));
    });

  return program;
}

/** Run the CLI on argv (without node and script) and return the exit code. */
export async function main(argv: readonly string[], streams: Streams = processStreams): Promise<number> {
  let code: number = exitCode.ok;
  const program = buildProgram(streams, (c) => {
    code = c;
  });
  try {
    await program.parseAsync([...argv], { from: 'user' });
    return code;
  } catch (error) {
    if (error instanceof CommanderError) {
      if (error.code === 'commander.helpDisplayed' || error.code === 'commander.version' || error.code === 'commander.help') {
        return exitCode.ok;
      }
      // commander has printed its message (unknown option, missing value, bad choice): that is bad input
      return exitCode.badInput;
    }
    return reportError(error, streams);
  }
}

function invokedDirectly(): boolean {
  const script = process.argv[1];
  if (script === undefined) return false;
  try {
    return realpathSync(script) === realpathSync(fileURLToPath(import.meta.url));
  } catch {
    return false;
  }
}

if (invokedDirectly()) {
  // a reader that stops early (gvf run m.json | head) is not an error
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
  main(process.argv.slice(2)).then(
    (code) => {
      process.exitCode = code;
    },
    (error: unknown) => {
      process.exitCode = reportError(error, processStreams);
    },
  );
}
