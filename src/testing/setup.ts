import "@testing-library/jest-dom/vitest";
import { afterEach } from "vitest";
import { cleanup, configure } from "@testing-library/react";

// findBy*/waitFor wait up to 3 s instead of 1 s: the designer's debounced analysis and the
// on-thread modeller can take longer than a second on a loaded 2-core CI machine.
configure({ asyncUtilTimeout: 3000 });

afterEach(() => {
  cleanup();
});
