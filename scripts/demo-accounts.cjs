// Prints the demo accounts for the start command.
const { ORGANIZATION, PASSWORD, PEOPLE } = require('../seeders/data/demo-accounts.cjs');

console.log(`\nDemo organisation: ${ORGANIZATION} (password for every account: ${PASSWORD})`);
for (const p of PEOPLE) console.log(`  ${p.role.padEnd(10)} ${p.email}`);
