import { exportUrls } from "../api/exports";

const linkClass =
  "inline-flex items-center gap-1.5 rounded-md border border-ink-soft bg-card px-3 py-1.5 text-sm font-medium text-ink hover:bg-paper-deep";

/** Download links of the plan's exports: the report PDF, the station layout CSV and the plan JSON. */
export function ExportLinks({ planId }: { planId: string }) {
  const urls = exportUrls(planId);
  return (
    <div className="flex flex-wrap gap-2" role="group" aria-label="Exports">
      <a className={linkClass} href={urls.report} download>
        Report (PDF)
      </a>
      <a className={linkClass} href={urls.stations} download>
        Station layout (CSV)
      </a>
      <a className={linkClass} href={urls.json} download>
        Plan (JSON)
      </a>
    </div>
  );
}
