import { Link, useParams } from "react-router-dom";
import { Card, ErrorNotice, Loading, PageHeader } from "@/components/feedback";
import { paths } from "@/app/paths";
import { useSite } from "../api/sites";

/** One site: its ground conditions. The site's plans are listed below (plans feature). */
export function SitePage({ children }: { children?: React.ReactNode }) {
  const { siteId = "" } = useParams();
  const site = useSite(siteId);
  if (site.isPending) return <Loading label="Loading the site…" />;
  if (site.isError) return <ErrorNotice error={site.error} title="Cannot show this site" />;
  return (
    <div>
      <p className="mb-2 text-sm">
        <Link to={paths.sites} className="text-ink underline">
          Sites
        </Link>{" "}
        › {site.data.name}
      </p>
      <PageHeader
        title={site.data.name}
        subtitle={site.data.archived ? "Archived site" : undefined}
      />
      <Card className="mb-6">
        <h2 className="mb-1 text-sm font-semibold tracking-wide text-ink-soft uppercase">
          Ground conditions
        </h2>
        <p className="text-sm whitespace-pre-line">
          {site.data.description || "No description yet."}
        </p>
      </Card>
      {children}
    </div>
  );
}
