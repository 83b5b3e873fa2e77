// Development: the API with demo data on port 3001 (watch mode) and Vite with its proxy on 5173.
import { spawn } from "node:child_process";

const env = {
  ...process.env,
  PORT: process.env.SPREADSIGHT_API_PORT ?? "3001",
  PUBLIC_URL: process.env.PUBLIC_URL ?? "http://127.0.0.1:5173",
};
const children = [
  spawn(process.execPath, ["--import", "tsx", "--watch", "server/main.ts", "--demo"], {
    stdio: "inherit",
    env,
  }),
  spawn(process.execPath, ["node_modules/vite/bin/vite.js"], { stdio: "inherit", env }),
];
const stop = () => children.forEach((child) => child.kill("SIGTERM"));
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
children.forEach((child) => child.on("exit", (code) => code && code !== 0 && stop()));
