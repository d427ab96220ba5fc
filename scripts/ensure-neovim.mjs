// Test set-up: test/editor/neovim.test.ts runs the documented Neovim set-up in Debian's Neovim.
// Installs it when missing and this user may (root with apt-get); otherwise says how and fails, so
// that the Neovim test never passes by being skipped.
import { execSync, spawnSync } from "node:child_process";
import { existsSync } from "node:fs";

const found = spawnSync("nvim", ["--version"], { encoding: "utf8" });
if (found.error) {
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (isRoot && existsSync("/usr/bin/apt-get")) {
    process.stderr.write("Installing Debian's neovim for the Neovim client test...\n");
    execSync("apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq neovim", {
      stdio: "inherit",
    });
  } else {
    process.stderr.write(
      "The Neovim client test needs nvim on the PATH. On Debian: sudo apt-get install neovim\n",
    );
    process.exit(1);
  }
}
