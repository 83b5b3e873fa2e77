import { useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import { can } from "@/contracts/common";
import type { SiteSummary } from "@/contracts/sites";
import { useMe } from "@/features/auth/api/me";
import { Button } from "@/components/button";
import { Card, EmptyState, ErrorNotice, Loading, PageHeader } from "@/components/feedback";
import { paths } from "@/app/paths";
import { useCreateSite, useSites, useUpdateSite, type SiteFilter } from "../api/sites";
import { SiteForm } from "./site-form";

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium" });

export function SitesPage() {
  const { data: me } = useMe();
  const [filter, setFilter] = useState<SiteFilter>("false");
  const [creating, setCreating] = useState(false);
  const [editingId, setEditingId] = useState<string | null>(null);
  const sites = useSites(filter);
  const createSite = useCreateSite();
  const updateSite = useUpdateSite();
  const mayEdit = me ? can.editSites(me.role) : false;
  const navigate = useNavigate();

  return (
    <div>
      <PageHeader
        title="Sites"
        subtitle="Each site gathers the survey plans drawn up for one place."
        actions={
          mayEdit && !creating ? (
            <Button onClick={() => setCreating(true)}>New site</Button>
          ) : undefined
        }
      />
      {creating ? (
        <Card className="mb-6">
          <h2 className="mb-3 font-semibold text-ink">New site</h2>
          <SiteForm
            submitLabel="Create site"
            pending={createSite.isPending}
            error={createSite.error}
            onCancel={() => {
              setCreating(false);
              createSite.reset();
            }}
            onSubmit={(values) =>
              // A new site has no plans yet: go straight to its plans to start one.
              createSite.mutate(values, { onSuccess: (site) => navigate(paths.site(site.id)) })
            }
          />
        </Card>
      ) : null}
      <div role="radiogroup" aria-label="Which sites" className="mb-4 flex flex-wrap gap-1 text-sm">
        {(
          [
            ["false", "Active"],
            ["true", "Archived"],
            ["all", "All"],
          ] as const
        ).map(([value, label]) => (
          <button
            key={value}
            type="button"
            role="radio"
            aria-checked={filter === value}
            onClick={() => setFilter(value)}
            className={`rounded-full px-3 py-1 ${filter === value ? "bg-ink text-card" : "bg-paper-deep text-ink"}`}
          >
            {label}
          </button>
        ))}
      </div>
      {sites.isPending ? <Loading label="Loading sites…" /> : null}
      {sites.isError ? <ErrorNotice error={sites.error} onRetry={() => sites.refetch()} /> : null}
      {updateSite.isError && editingId === null ? (
        <ErrorNotice error={updateSite.error} title="Could not change the site" />
      ) : null}
      {sites.data && sites.data.length === 0 ? (
        <EmptyState title={filter === "true" ? "No archived sites" : "No sites yet"}>
          {filter === "true"
            ? "A site you archive leaves the active list and waits here until it is restored."
            : mayEdit
              ? "Create one to start planning a survey."
              : "A survey lead creates sites."}
        </EmptyState>
      ) : null}
      <ul className="grid gap-4 md:grid-cols-2">
        {sites.data?.map((site) =>
          editingId === site.id ? (
            <li key={site.id}>
              <Card>
                <SiteForm
                  initial={{ name: site.name, description: site.description }}
                  submitLabel="Save"
                  pending={updateSite.isPending}
                  error={updateSite.error}
                  onCancel={() => {
                    setEditingId(null);
                    updateSite.reset();
                  }}
                  onSubmit={(values) =>
                    updateSite.mutate(
                      { id: site.id, ...values },
                      { onSuccess: () => setEditingId(null) },
                    )
                  }
                />
              </Card>
            </li>
          ) : (
            <SiteCard
              key={site.id}
              site={site}
              mayEdit={mayEdit}
              onEdit={() => setEditingId(site.id)}
              onArchive={(archived) => updateSite.mutate({ id: site.id, archived })}
            />
          ),
        )}
      </ul>
    </div>
  );
}

function SiteCard({
  site,
  mayEdit,
  onEdit,
  onArchive,
}: {
  site: SiteSummary;
  mayEdit: boolean;
  onEdit: () => void;
  onArchive: (archived: boolean) => void;
}) {
  return (
    <li>
      <Card className={site.archived ? "opacity-75" : ""}>
        <div className="flex items-start justify-between gap-3">
          <h2 className="min-w-0 text-lg font-semibold break-words text-ink-deep">
            <Link to={paths.site(site.id)} className="hover:underline">
              {site.name}
            </Link>
          </h2>
          {site.archived ? (
            <span className="rounded-full bg-paper-deep px-2 py-0.5 text-xs font-medium text-ink-soft">
              Archived
            </span>
          ) : null}
        </div>
        <p className="mt-2 text-sm whitespace-pre-line text-ink-soft">
          {site.description || "No description yet."}
        </p>
        <p className="mt-3 text-xs text-ink-faint">
          {site.planCount} plan{site.planCount === 1 ? "" : "s"} · created by {site.createdBy} ·{" "}
          {dateFormat.format(new Date(site.createdAt))}
        </p>
        {mayEdit ? (
          <div className="mt-3 flex flex-wrap gap-2">
            <Button variant="secondary" onClick={onEdit} aria-label={`Rename ${site.name}`}>
              Rename
            </Button>
            <Button
              variant="quiet"
              onClick={() => onArchive(!site.archived)}
              aria-label={`${site.archived ? "Restore" : "Archive"} ${site.name}`}
            >
              {site.archived ? "Restore" : "Archive"}
            </Button>
          </div>
        ) : null}
      </Card>
    </li>
  );
}
