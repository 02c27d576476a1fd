/**
 * The help texts of every command, in one place. Every example here is a real command line that
 * works on the repository's demo data or describes a file the user has (no invented flags).
 */

export const MAIN_HELP = `
similis turns raw rig measurements into dimensionless groups and fitted correlations you can
defend: units converted exactly, every formula dimension-checked, every excluded row explained.

Pipeline:  CSV with units -> SI -> groups -> fit -> compare with handbook forms -> report
Commands: units (convert), reduce (rig files to groups), fit (correlation, intervals, report),
batch (a campaign of files, in parallel, with an index page), predict (a correlation at a design
point, with intervals), groups (Buckingham Pi), handbook (published correlations), props (water
and air), demo (both demo campaigns).

Examples:
  $ similis units 12.5 psi --to kPa
  $ similis units "lb/ft^3"
  $ similis units --list
  $ similis reduce data-demo/mini-loop/loop-a.csv --derive "U=4*Q/(pi*D^2)" --group "Re=rho*U*D/mu"
  $ similis fit --study data-demo/mini-loop/study.yaml --out reports/mini-loop
  $ similis batch data-demo/pressure-drop --study data-demo/pressure-drop/study.yaml --out reports/pressure-drop
  $ similis predict reports/pressure-drop/pooled.json --at Re=3e4,LD=100
  $ similis demo

Exit codes: 0 done; 1 done, with warnings treated as errors (--strict); 2 bad input (the message
names file, line and column and what was expected); 3 internal fault (please report it).
With --json, stdout carries exactly one JSON document; messages and warnings go to stderr.`;

export const UNITS_HELP = `
Without --to, describes the unit: its factor to SI, its dimension over M L T Θ N I J, the
quantity it measures, and whether the factor is exact (NIST SP 811 Appendix B, SI Brochure).

Unit expressions: products (N*m, N.m, N·m, "N m"), quotients (kg/m^3; a/b/c is read left to
right, with a warning), powers (m^2, m2, m², s^-1, m^(1/2)), parentheses (W/(m*K)), SI prefixes
on SI units (kPa, mL, µm or um). A bare degC/degF is an absolute temperature; inside a compound
unit (J/(kg*degC)) a temperature is a difference; write delta_degC or delta_degF for a bare
difference. inH2O is the conventional inch of water (1000 kg/m^3, g_n: 249.08891 Pa);
inH2O_4C (39.2 degF water, 249.082 Pa) and inH2O_60F (248.84 Pa) are the other two.

Examples:
  $ similis units 12.5 psi --to kPa          12.5 psi = 86.184466 kPa
  $ similis units 68 degF --to degC          an absolute temperature: 20 degC
  $ similis units 1 gpm --to "m^3/s"
  $ similis units "lb/ft^3"                  factor to SI 16.018463 (kg m^-3), a density
  $ similis units 3 "delta_degF" --to K      a temperature difference: 1.6666667 K
  $ similis units --list                     every known unit with its definition and source
  $ similis units 1 bar --to psi --json      {"value":1,"from":"bar","to":"psi","result":14.50377...}`;

export const REDUCE_HELP = `
Reads rig CSV files and computes, for every row, the study's derived quantities (in SI) and
dimensionless groups. Every group is checked dimensionless against every file's header before any
row is read; rows with a missing value, a non-finite result or a false where condition are left
out and listed with file, line and reason. Output columns: file, line, then the derived
quantities (U [m s^-1]) and groups in study order, in full double precision.

Rig CSV file (comma, semicolon or tab; UTF-8, BOM and CRLF accepted):
  # D = 0.5 in                       a constant of this file (number and unit)
  # u(dp) = 0.5 % + 0.02 kPa         a standard uncertainty (kept for a later stage)
  # any other line starting with #   a comment, kept
  run,Q [L/min],dp [kPa]             header: name [unit], or a bare name (dimensionless or text)
  R01,0.3,0.009432                   rows; empty, NA, NaN, N/A or - mark a missing value

Study file (YAML):
  title: Mini loop, tube A
  data: [runs/*.csv]                 used when no files are named on the command line
  constants: { rho: 998.21 kg/m^3, mu: 1.0016 mPa*s }
  derived:   { U: 4*Q/(pi*D^2) }
  groups:    { Re: rho*U*D/mu, f: dp*D/(L*0.5*rho*U^2), LD: L/D }
  fit:       { where: Re > 4000 }     the row filter (--where replaces it)

Examples:
  $ similis reduce data-demo/mini-loop/loop-a.csv --derive "U=4*Q/(pi*D^2)" --group "Re=rho*U*D/mu"
  $ similis reduce data-demo/mini-loop/loop-a.csv --derive "U=4*Q/(pi*D^2)" \
      --group "Re=rho*U*D/mu" --group "f=dp*D/(L*0.5*rho*U^2)" --where "Re > 2000" --json
  $ similis reduce runs/*.csv --study pipe-friction.yaml -o reduced.csv
  $ similis reduce --study pipe-friction.yaml -o reduced.csv        files from the study's data:
  $ similis reduce runs/*.csv --study pipe-friction.yaml --const D="12.7 mm"
  $ similis reduce export.csv --delimiter ";" --study pipe-friction.yaml

Without -o the CSV goes to stdout (and excluded rows to stderr, as warnings); with -o the file is
written whole or not at all (a failed run leaves an existing file untouched). Files of more than
a few MB show a progress line when stderr is a terminal.`;

export const DEMO_HELP = `
Runs the two invented demo campaigns of data-demo/ exactly as similis batch runs a campaign, into
reports/demo/ under the working folder, and prints where the pages are:
  reports/demo/index.html                  links both campaigns
  reports/demo/pressure-drop/index.html    nine tubes on a water loop (two of them steel)
  reports/demo/settling/index.html         glass and steel spheres in water-glycerol mixtures
data-demo/README.md states the truth the files were generated from, so the reports can be judged
against it. npm run demo builds first, then runs this.

Examples:
  $ similis demo
  $ similis demo --jobs 1 --quiet`;

export const PROPS_HELP = `
Density, dynamic and kinematic viscosity of liquid water (IAPWS-IF97 region 1, IAPWS R12-08) or
dry air (ideal gas, Sutherland's law), each with its published source and validity range. The
pressure is absolute; without one, 101.325 kPa is used and the output says so. Outside a model's
range the command stops with exit code 2 and names the range: it never extrapolates.

Examples:
  $ similis props water 20 degC                 998.2061 kg/m^3, 1.001597 mPa s, 1.003397 mm^2/s
  $ similis props water 68 degF                 the same state
  $ similis props water 120 degC 3 bar          pressurised liquid (at 1 atm it would boil: exit 2)
  $ similis props air 20 degC 101.325 kPa       1.204105 kg/m^3, 18.13406 uPa s
  $ similis props air -40 degF --json`;

export const HANDBOOK_HELP = `
Lists the handbook correlations (id, range of validity, source, form), shows one in full,
evaluates one at given inputs, or solves the settling velocity of a sphere from a drag law.
Friction factors are Darcy (f_D); each has an explicit Fanning twin '<id>-fanning' (f_F = f_D/4).
Outside the range its source states, eval gives the value and an 'outside-range' warning.

Examples:
  $ similis handbook                                       every correlation, by family
  $ similis handbook --family drag                         friction, drag or heat
  $ similis handbook show swamee-jain                      equation, inputs, range and its source, accuracy
  $ similis handbook eval colebrook Re=1e5 roughness=1e-4  f_D = 0.0185138660775
  $ similis handbook eval blasius Re=5e5                   the value, and warning outside-range (Re <= 1e5)
  $ similis handbook eval gnielinski Re=1e5 Pr=1.2         f_D optional: Filonenko smooth tube by default
  $ similis handbook settle clift-gauvin diameter=1mm particleDensity=2500kg/m^3 fluidDensity=998.2kg/m^3 "viscosity=1.0016mPa*s"
                                                           terminal velocity 0.145737 m/s
  $ similis handbook eval colebrook Re=1e5 roughness=1e-4 --json`;

export const GROUPS_HELP = `
List the variables that matter; groups finds how many independent dimensionless groups they form
(Buckingham Pi: n variables minus the rank of the dimensional matrix, in exact fractions), picks a
set, and names the groups of the trade among them, up to a power and a numeric factor (a Reynolds
number written with a volume flow is pi/4 times the pipe Reynolds number, and it says so). The
groups print as formulas ready for a study file's groups:. With --study, it also checks the
study's groups: dimensionless, independent, and covering every variable the data vary.

Kinds: where two quantities share a dimension (a gravity and another acceleration; kinematic
viscosity and diffusivity) the name decides (rho*, mu*, nu*, g, sigma, ...) or a hint: NAME=UNIT:kind.

Examples:
  $ similis groups --var dp=Pa --var rho=kg/m^3 --var "mu=Pa*s" --var D=m --var L=m --var U=m/s --response dp
  $ similis groups --var dp=kPa --var rho=kg/m^3 --var mu=cP --var D=in --var L=m --var Q=L/min --response dp
  $ similis groups --var Vt=m/s --var d=mm --var rho=kg/m^3 --var rho_p=kg/m^3 --var "mu=mPa*s" --var g=m/s^2
  $ similis groups --var U=m/s --var L=m --var x=m/s^2:gravity
  $ similis groups data-demo/mini-loop/loop-a.csv --response dp
  $ similis groups --var dp=Pa --var rho=kg/m^3 --var "mu=Pa*s" --var D=m --var U=m/s --repeat rho,U,D --json`;

export const FIT_HELP = `
Reads and reduces the rig files exactly as reduce does, pools the rows of every file, and fits the
study's correlation: a power product of groups (C*Re^a*LD^b) by linear least squares on the
logarithms, anything else by nonlinear least squares (Levenberg-Marquardt with exact derivatives).
Prints the parameters with 95 % intervals, the goodness of fit, the range of the data (the only
range where the correlation holds), the handbook comparison and the points to look at. With --out
it writes NAME.json (every number), NAME.csv (every point, with file and line) and NAME.html (the
report for a reviewer: plots, tables, cautions), all three or none.

The study's fit section:
  fit:
    response: f                       a group (or derived quantity) of the study
    model: C*Re^a*LD^b                any formula in groups and parameters
    parameters: { C: 0.3, a: -0.25, b: 0 }   start values
    method: auto                      auto | log-linear | nonlinear
    where: Re > 4000                  the rows to fit (--where replaces it)
    robust: none                      none | huber | bisquare (down-weights outliers, and says which)
  compare: [blasius, {colebrook: {roughness: eps_D}}]   handbook forms (similis handbook lists them)

Examples:
  $ similis fit data-demo/mini-loop/loop-a.csv --study data-demo/mini-loop/study.yaml
  $ similis fit --study data-demo/mini-loop/study.yaml --out reports/mini-loop
  $ similis fit --study data-demo/mini-loop/study.yaml --out reports/mini-loop --interactive
  $ similis fit --study data-demo/mini-loop/study.yaml --method nonlinear --json
  $ similis fit --study data-demo/mini-loop/study.yaml --model "C*Re^a" --param C=0.3 --param a=-0.25
  $ similis fit runs/*.csv --study pipe-friction.yaml --where "Re > 4000 and LD >= 20" --robust huber

A fitted correlation holds only inside the range of its data; sizing of piping or pressure
equipment follows the applicable codes and a qualified engineer's judgement.`;

export const BATCH_HELP = `
A campaign is many rig files reduced with one study. batch reduces and fits every file on its own
(each in a worker thread, --jobs at a time), pools the rows of all files and fits them once, and
compares each file with the pooled fit. It writes, in the --out folder:
  index.html, index.json      the table of files (rows used and excluded, estimates with their
                              intervals, deviation from the handbook forms, warnings), a plot of
                              each parameter file by file against the pooled value, the failures
  pooled.json, .csv, .html    the pooled fit, as similis fit --out writes it
  files/NAME.json, .csv, .html  one report per file (NAME from the file's name, made safe)
A file whose parameters disagree with the pooled fit beyond their intervals is flagged
(warning file-disagrees; the index states the test). An exponent of a group that is constant in
a file (L/D of one tube) is held in that file's fit, and its coefficient compared at the pooled
exponent. A bad file never stops the campaign: it is listed with its file, line and reason, the
others are written, and the exit code is 2. Progress goes to stderr: a bar on a terminal, one line
per file otherwise, nothing with --quiet.

Examples:
  $ similis batch data-demo/pressure-drop --study data-demo/pressure-drop/study.yaml --out reports/pressure-drop
  $ similis batch "data-demo/settling/*.csv" --study data-demo/settling/study.yaml --out reports/settling --jobs 2
  $ similis batch --study data-demo/pressure-drop/study.yaml --out reports/pd --quiet     files from the study's data:
  $ similis batch data-demo/pressure-drop --study data-demo/pressure-drop/study.yaml --out reports/pd --where "Re > 10000" --json

A fitted correlation holds only inside the range of its data; sizing of piping or pressure
equipment follows the applicable codes and a qualified engineer's judgement.`;

export const PREDICT_HELP = `
Evaluates the correlation a fit report keeps (NAME.json from similis fit --out, or pooled.json and
files/NAME.json from similis batch) at design points, each with its confidence interval (where the
mean lies) and prediction interval (where one new measurement would fall), by the delta method
from the fit's covariance. A fit made on logarithms gets both intervals for ln y, transformed back
(asymmetric). Each point gets a verdict: inside the data, or an extrapolation (warning
extrapolation) when a group is outside its range in the data, or when the point is inside every
range but farther from the data than any fitted point (its leverage above the largest of the fit).

A point is groups (--at Re=5e4,LD=120), or measured quantities with units that the study's
derived quantities and groups are computed from (--at Q="30 L/min",T="40 degC",D="16 mm",L="1.6 m");
a file constant that is the same in every file of the fit (gravity, a fall height) may be left out.

Examples:
  $ similis predict reports/pressure-drop/pooled.json --at Re=3e4,LD=100
  $ similis predict reports/pressure-drop/pooled.json --at Re=3e4,LD=100 --at Re=5e5,LD=100
  $ similis predict reports/pressure-drop/pooled.json --at Q="30 L/min",T="40 degC",D="16 mm",L="1.6 m"
  $ similis predict reports/settling/pooled.json --at Re=20,rho_ratio=3 --json

A fitted correlation holds only inside the range of its data; sizing of piping or pressure
equipment follows the applicable codes and a qualified engineer's judgement.`;
