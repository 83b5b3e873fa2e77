// Installs Debian's Chromium when /usr/bin/chromium is missing (end-to-end tests need it).
import { existsSync } from "node:fs";
import { execSync } from "node:child_process";

const chromium = process.env.SPREADSIGHT_CHROMIUM ?? "/usr/bin/chromium";
if (existsSync(chromium)) {
  process.exit(0);
}
console.log(`[ensure-chromium] ${chromium} is missing; installing Debian's chromium package`);
const sudo = process.getuid && process.getuid() !== 0 ? "sudo " : "";
try {
  execSync(`${sudo}apt-get update -qq`, { stdio: "inherit" });
  execSync(`${sudo}env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium`, {
    stdio: "inherit",
  });
} catch (error) {
  console.error("[ensure-chromium] could not install chromium:", error.message);
  process.exit(1);
}
