import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetStatus } from '../../../../shared/policy/policy';

export interface VersionRow {
  number: number;
  authorId: number;
  authorName: string;
  createdAt: number;
  note: string;
  seed: string;
  engineVersion: string;
  documentSha256: string;
  approvedBy: number | null;
  approvedAt: number | null;
}

export interface BudgetHeader {
  id: number;
  title: string;
  status: BudgetStatus;
  returned: boolean;
  currentVersion: number;
  approvedVersion: number | null;
  ownerId: number;
}

export const versionsQuery = (id: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'versions'],
    queryFn: () => api<VersionRow[]>(`/api/budgets/${id}/versions`),
  });

export const budgetHeaderQuery = (id: number) =>
  queryOptions({
    queryKey: ['budgets', id],
    queryFn: () => api<BudgetHeader>(`/api/budgets/${id}`),
  });

export function useVersions(id: number) {
  return useQuery(versionsQuery(id));
}

export function useBudgetHeader(id: number) {
  return useQuery(budgetHeaderQuery(id));
}

export interface FieldChange {
  field: string;
  from: unknown;
  to: unknown;
}

export interface Delta {
  from: number | null;
  to: number | null;
  delta: number | null;
}

export interface KeyedDiff {
  added: Record<string, unknown>[];
  removed: Record<string, unknown>[];
  changed: { key: string; changes: FieldChange[] }[];
}

/** The server's structured difference of two versions (GET /api/budgets/:id/diff). */
export interface BudgetDiff {
  from: number;
  to: number;
  model: { changed: boolean; from: string; to: string };
  measurand: FieldChange[];
  inputs: KeyedDiff;
  constants: KeyedDiff;
  correlations: KeyedDiff;
  other: FieldChange[];
  result: {
    estimate: Delta;
    standardUncertainty: Delta;
    expandedUncertainty: Delta;
    coverageFactor: Delta;
    effectiveDof: Delta;
    monteCarlo: { estimate: Delta; standardUncertainty: Delta; intervalLow: Delta; intervalHigh: Delta } | null;
    contributions: { symbol: string; contribution: Delta; varianceShare: Delta; sensitivity: Delta; standardUncertainty: Delta }[];
  };
}

export const diffQuery = (id: number, from: number, to: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'diff', from, to],
    queryFn: () => api<BudgetDiff>(`/api/budgets/${id}/diff?from=${from}&to=${to}`),
    staleTime: Infinity,
  });

export function useDiff(id: number, from: number | undefined, to: number | undefined) {
  return useQuery({ ...diffQuery(id, from ?? 0, to ?? 0), enabled: !!from && !!to && from !== to });
}

/** The measurand unit of a version, for the result table of a comparison. */
export const versionUnitQuery = (id: number, n: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'versions', n],
    queryFn: () => api<{ number: number; document: { measurand: { symbol: string; unit?: string } }; result: { measurand: { symbol: string; unit?: string } } }>(`/api/budgets/${id}/versions/${n}`),
    staleTime: Infinity,
  });
