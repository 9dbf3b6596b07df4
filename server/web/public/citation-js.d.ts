// The part of citation-js that Fairweigh uses; the package ships no types of its own.
declare module "@citation-js/core" {
  export class Cite {
    constructor(data: unknown);
    data: Record<string, unknown>[];
    format(format: string, options?: Record<string, unknown>): string;
  }
}
declare module "@citation-js/plugin-bibtex";
declare module "@citation-js/plugin-csl";
declare module "@citation-js/plugin-ris";
