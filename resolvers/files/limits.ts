/** The limits of a contract-file import, each with its default (an import may set lower or higher ones). */
export interface FileLimits {
  /**
   * Largest file read, in bytes (a PDF, a Word file, a text file, an archive inside an archive). Default 49,999,999:
   * a file of 50 MB or more is refused with its size. Decimal megabytes (50,000,000 bytes), as file managers and
   * most people state file sizes; 50 MiB (52,428,800) let a file shown as "50 MB" through.
   */
  maxFileBytes: number;
  /** Most entries one archive may list. Default 50,000. */
  maxEntries: number;
  /** Largest total uncompressed size of one archive's entries, in bytes. Default 4 GiB. */
  maxTotalBytes: number;
  /**
   * Largest uncompressed/compressed ratio of one archive entry once it is over ratioFloorBytes uncompressed.
   * Default 200: deflate gives about 3–10× on prose and about 1,000× on runs of one byte (common practice).
   */
  maxRatio: number;
  /** Entries smaller than this are not held to maxRatio (tiny files compress oddly). Default 1 MiB. */
  ratioFloorBytes: number;
  /** Largest total uncompressed size of one Word (.docx) package, in bytes. Default 200 MB. */
  maxPackageBytes: number;
  /** Archives inside archives read: 1 (an archive in the folder or archive given is read; one inside that is not). */
  maxNesting: number;
}

export const FILE_LIMIT_DEFAULTS: FileLimits = {
  maxFileBytes: 50_000_000 - 1,
  maxEntries: 50_000,
  maxTotalBytes: 4 * 1024 * 1024 * 1024,
  maxRatio: 200,
  ratioFloorBytes: 1024 * 1024,
  maxPackageBytes: 200 * 1024 * 1024,
  maxNesting: 1,
};
