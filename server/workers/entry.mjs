// Worker entry when the server runs from TypeScript (tsx, vitest): registers tsx in this
// thread, then loads the tasks. The compiled server (npm run build) uses build/server/tasks.js.
import { register } from "tsx/esm/api";

register();
const tasks = await import("./tasks.ts");
export default tasks.default;
