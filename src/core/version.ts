/** The program's name and version, as reports and `gvf --version` show them (kept equal to package.json's by a test). */
export const programName = 'gvf';
export const programVersion = '0.1.0';
