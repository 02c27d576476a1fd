/**
 * Every user-facing message of the reduce stage, in one place: what was found and what to do.
 */
export const reduceMessages = {
  nameClash: (name: string, role: string, file: string, existing: string) =>
    `${role} ${name} has the name of ${existing} of ${file}: rename the ${role} (formulas would not know which ${name} is meant)`,
  textColumn: (name: string, file: string, example: string) =>
    `${name} is a text column of ${file} (labels such as '${example}'): formulas need numbers; give the column numbers and a unit, or leave it out of the formulas`,
  dimensionDiffers: (name: string, fileA: string, dimA: string, fileB: string, dimB: string) =>
    `${name} is ${dimA} in ${fileA} but ${dimB} in ${fileB}: the output has one unit per column; check the units of the columns it uses in both files`,
  nothing: () => 'nothing to compute: give a study file (--study) or at least one --derive or --group',
  notANumber: (role: string, name: string, text: string) =>
    `${role} ${name} = ${text} is a condition (true or false), but a ${role} must be a number`,
  unknownNameHint: (file: string, columns: string, constants: string) =>
    `${file} has the columns ${columns}${constants === '' ? ' and no constants' : ` and the constants ${constants}`}`,
  fileConstantOverrides: (name: string, fileValue: string, studyValue: string, studyWhere: string) =>
    `${name} = ${fileValue} in this file overrides the study constant ${name} = ${studyValue}${studyWhere}`,
  columnOverrides: (name: string, studyValue: string, studyWhere: string) =>
    `this file has a column ${name}, so the study constant ${name} = ${studyValue}${studyWhere} is not used for it`,
  missing: (column: string, text: string) => `missing value in column ${column} (${text === '' ? 'empty cell' : `'${text}'`})`,
  nonFinite: (name: string, cause: string, formula: string) => `${name} is not finite (${cause}, in ${formula})`,
  nonFiniteNoCause: (name: string, formula: string) => `${name} is not finite (in ${formula})`,
  whereFalse: (text: string) => `where: ${text} is false`,
  fitResponse: (name: string, known: string) => `fit.response ${name} is not a group, derived quantity or column: the names are ${known}`,
  fitDimension: (model: string, dim: string, response: string, responseDim: string) =>
    `fit.model ${model} is ${dim}, but the response ${response} is ${responseDim}: both sides must have the same dimension`,
  uncertaintyName: (name: string, file: string, known: string) =>
    `uncertainty.${name} names no column or constant of ${file}: the names are ${known}`,
  temperatureDifference: (call: string, argument: string, why: string) =>
    `${call} needs an absolute temperature, but ${argument} is a temperature difference (${why}): ` +
    'the dimension check cannot tell the two apart, the unit can; log the temperature in degC, degF or K, or add the difference to a reference temperature',
  uncertaintyOverridden: (name: string, fileText: string, studyText: string, studyWhere: string) =>
    `u(${name}) = ${fileText} in this file overrides the study's uncertainty ${name}: ${studyText}${studyWhere}`,
  monteCarloSamples: (n: number, min: number) =>
    `--monte-carlo ${String(n)}: the Monte Carlo check needs a whole number of at least ${min} draws per row (JCGM 101:2008 suggests 10^4 or more)`,
  monteCarloSeed: (seed: number) => `the Monte Carlo seed ${String(seed)} is not a whole number`,
  monteCarloUnused: (file: string) =>
    `${file}: no uncertainty is stated (no # u(...) lines, no uncertainty section in the study), so there is nothing for the Monte Carlo check to check`,
  uncertaintyColumnClash: (name: string, output: string) =>
    `the output ${name} has the name of the uncertainty column of ${output} (u_${output}): rename it, since the reduced table gives u_${output} beside ${output}`,
  uncertaintyNotStated: (file: string, others: string) =>
    `${file} states no uncertainty for any input (no # u(...) lines, and the study's uncertainty section names none of its names), ` +
    `while ${others} does: its u_ columns are 0, which treats its inputs as exact`,
} as const;
