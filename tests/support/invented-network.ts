// An invented three-arm network for unit tests (binary outcome, higher is better): s1 and s4
// compare placebo and alpha, s2 placebo and beta, s3 alpha and beta.
import { analyse } from "#core/nma/analyse";
import { parseDataset } from "#core/nma/parse";

export const inventedCsv = `study,treatment,events,total
s1,placebo,20,100
s1,alpha,40,100
s2,placebo,18,90
s2,beta,30,90
s3,alpha,35,80
s3,beta,30,80
s4,placebo,25,120
s4,alpha,50,120
`;

export const inventedSettings = { measure: "OR" as const, model: "fixed" as const, reference: "placebo", better: "higher" as const, draws: 500 };
export const inventedDataset = parseDataset(Buffer.from(inventedCsv), "arm-binary");
export const inventedResult = analyse(inventedDataset, inventedSettings);
