import { z } from 'zod';

export const supersedeSchema = z.object({
  limit: z.number().positive().max(1e9),
  reason: z.string().trim().min(10, 'say what is corrected').max(2000),
  override: z.boolean().default(false),
}).strict();

export interface AdvisoryView {
  id: number;
  docId: string;
  stockId: number;
  stockName: string;
  regionId: number;
  regionName: string;
  approvedLimit: number;
  override: boolean;
  title: string;
  summary: string;
  sha256: string;
  supersedesId: number | null;
  supersededById: number | null;
  publishedAt: string;
}
