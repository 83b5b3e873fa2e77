/** Download links of a plan's exports (GET, served as attachments). */
export const exportUrls = (planId: string) => {
  const base = `/api/plans/${encodeURIComponent(planId)}`;
  return {
    report: `${base}/report.pdf`,
    stations: `${base}/stations.csv`,
    json: `${base}/export.json`,
    /** The interpreted section under the line (needs saved picks). */
    interpretation: `${base}/interpretation.csv`,
  };
};
