/** Sites: a place where surveys are planned. */
import { z } from "zod";

export const siteCreateSchema = z.strictObject({
  name: z
    .string()
    .trim()
    .min(1, "name is required")
    .max(120, "name must be at most 120 characters"),
  description: z
    .string()
    .trim()
    .max(2000, "description must be at most 2000 characters")
    .default(""),
});
export type SiteCreateInput = z.input<typeof siteCreateSchema>;

export const siteUpdateSchema = z
  .strictObject({
    name: z
      .string()
      .trim()
      .min(1, "name is required")
      .max(120, "name must be at most 120 characters"),
    description: z.string().trim().max(2000, "description must be at most 2000 characters"),
    archived: z.boolean({ error: "archived must be true or false" }),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, "nothing to change");
export type SiteUpdateInput = z.input<typeof siteUpdateSchema>;

export const siteListQuerySchema = z.strictObject({
  archived: z.enum(["true", "false", "all"]).default("false"),
});

export interface SiteSummary {
  id: string;
  name: string;
  description: string;
  archived: boolean;
  createdBy: string;
  createdAt: string;
  updatedAt: string;
  planCount: number;
}
