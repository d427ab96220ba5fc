// Test set-up: the preview and report tests render pages in Debian's Chromium. Installs it when
// missing and this user may (root with apt-get); otherwise says how and fails, so that browser
// tests never pass by being skipped.
import { existsSync } from "node:fs";
import { execSync } from "node:child_process";

const CHROMIUM = "/usr/bin/chromium";

if (!existsSync(CHROMIUM)) {
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  const hasApt = existsSync("/usr/bin/apt-get");
  if (isRoot && hasApt) {
    process.stderr.write("Installing Debian's chromium for the browser tests...\n");
    execSync("apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium", {
      stdio: "inherit",
    });
  } else {
    process.stderr.write(
      "The browser tests need Chromium at /usr/bin/chromium. On Debian: sudo apt-get install chromium\n",
    );
    process.exit(1);
  }
}
