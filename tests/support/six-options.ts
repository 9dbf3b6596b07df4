// An invented six-option network in which most pairs were never compared in a trial (binary outcome,
// higher is better, reference "placebo"): placebo–alpha, placebo–beta, placebo–gamma, alpha–beta,
// beta–delta and gamma–epsilon were compared directly; the other nine pairs only indirectly. Five of
// those have a first-order loop (placebo–delta through beta, placebo–epsilon through gamma,
// alpha–gamma and beta–gamma through placebo, alpha–delta through beta); four have none
// (alpha–epsilon, beta–epsilon, gamma–delta, delta–epsilon), so the analysts set them.
export const sixOptionsCsv = `study,treatment,events,total
s1,placebo,20,100
s1,alpha,35,100
s2,placebo,15,80
s2,alpha,28,80
s3,placebo,22,100
s3,beta,30,100
s4,placebo,18,90
s4,gamma,25,90
s5,alpha,30,100
s5,beta,27,100
s6,beta,25,100
s6,delta,38,100
s7,gamma,20,90
s7,epsilon,24,90
s8,placebo,19,95
s8,beta,29,95
`;

export const sixOptionsNames = { placebo: "Placebo", alpha: "Alpha", beta: "Beta", gamma: "Gamma", delta: "Delta", epsilon: "Epsilon" };

/** The nine pairs no trial compared (as "a|b", alphabetically), and the four of them with no first-order loop. */
export const indirectOnlyPairs = ["alpha|delta", "alpha|epsilon", "alpha|gamma", "beta|epsilon", "beta|gamma", "delta|epsilon", "delta|gamma", "delta|placebo", "epsilon|placebo"];
export const withoutLoop = ["alpha|epsilon", "beta|epsilon", "delta|epsilon", "delta|gamma"];
