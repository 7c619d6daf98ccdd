export interface Answer {
  status: number;
  type: string;
  text: string;
  location: string | null;
}
export interface ExpectedAnswer {
  expectType: string;
  check?: (text: string) => string | null;
}
export declare function wrongAnswer(endpoint: ExpectedAnswer, answer: Answer): string | null;
export interface RunResult {
  non2xx: number;
  errors: number;
  timeouts: number;
  '2xx': number;
  requests: { total: number };
  statusCodeStats?: Record<string, { count: number }>;
}
export declare function runProblems(result: RunResult, seconds: number): string[];
export declare function throughputVerdict(
  row: { problems: string[]; target: number | null; requestsPerSecond?: number },
  reference: number | null,
): { result: 'FAILED' | 'reference' | 'FAILED (no reference)' | 'met' | 'NOT met'; ratio: number | null };
export declare function scriptSources(html: string): { sources: string[]; noModule: number };
