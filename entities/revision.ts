import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Spectrum, verdicts } from './spectrum';
import { User } from './user';

export const screeningStatuses = ['pending', 'done', 'error'] as const;
export type ScreeningStatus = (typeof screeningStatuses)[number];

/** Where and why a file did not parse (ParseError), or why screening gave up. */
export interface ScreeningErrorInfo {
  message: string;
  line: number | null;
  column: number | null;
  expected: string | null;
  found: string | null;
}

/** The parts of the screening JSON that are not findings (those are rows of `finding`). */
export interface ScreeningSummary {
  format: 'columns' | 'yaml';
  qpoints: number;
  branches: number;
  segments: number;
  folded: { index: number; q: number[]; folded: number[] }[];
}

export const Revision = defineEntity({
  name: 'Revision',
  tableName: 'revision',
  properties: (p) => ({
    id: uuidPk(),
    spectrum: p.manyToOne(Spectrum).deleteRule('cascade'),
    number: p.integer(),
    /** The upload service's key: unique, so a replayed upload callback finds its revision. */
    fileKey: p.string().length(300).unique(),
    ufsUrl: p.text(),
    originalName: p.string().length(255),
    size: p.bigint('number'),
    /** 'columns' or 'yaml', from the file name (the parser may still sniff the content). */
    format: p.string().length(16),
    note: p.text().nullable(),
    uploader: p.manyToOne(User).nullable().deleteRule('set null'),
    screeningStatus: p.enum([...screeningStatuses]).default('pending'),
    screeningError: p.json<ScreeningErrorInfo>().columnType('jsonb').nullable(),
    verdict: p.enum([...verdicts]).nullable(),
    summary: p.json<ScreeningSummary>().columnType('jsonb').nullable(),
    failCount: p.integer().default(0),
    warnCount: p.integer().default(0),
    infoCount: p.integer().default(0),
    createdAt: createdAt(),
    screenedAt: p.datetime().nullable(),
  }),
  uniques: [{ properties: ['spectrum', 'number'] }],
  indexes: [{ properties: ['screeningStatus', 'createdAt'] }],
});
export type Revision = InferEntity<typeof Revision>;
