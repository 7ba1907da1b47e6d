/**
 * Version of the tables behind every calculator (threads, drills, clearance
 * holes, screw heads, plates, gears, speeds). A saved result records it, so a
 * later correction of a table can be told apart from the numbers a builder
 * actually worked with. Bump it whenever any table or rule changes a result.
 */
export const TABLES_VERSION = '2026.1';
