#!/usr/bin/env node
// The `poise` command: a thin launcher for the bundled CLI in dist/.
const path = require("node:path");
const fs = require("node:fs");
const cli = path.join(__dirname, "..", "dist", "cli.js");
if (!fs.existsSync(cli)) {
  process.stderr.write("poise: dist/cli.js is missing; run `npm run build` first\n");
  process.exit(2);
}
require(cli);
