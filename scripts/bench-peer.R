# The command line's peer in `npm run bench`: the same analysis of an arm-continuous file (mean
# difference) as a statistician would script it with a general-purpose package — R with metafor
# (Viechtbauer, J Stat Softw 2010;36(3)), Debian's r-base-core and r-cran-metafor — following
# METHODS.md §2–§6: the contrast-based model with common heterogeneity (REML, correlation ½), the
# fixed-effect Q and its decomposition by design, direct and back-calculated indirect estimates
# per pair, P-scores and 10 000-draw SUCRA. With `all`, also §13 as the reference values were
# computed (tests/fixtures/reference/README.md): each study's importance from a refit without it
# (τ² and the correlation held), and the risk-of-bias shares of the direct estimates — the whole of
# what our command line prints.
#
#   Rscript scripts/bench-peer.R FILE.csv REFERENCE [all]   (prints one JSON line of check values)
suppressPackageStartupMessages(library(metafor))

args <- commandArgs(trailingOnly = TRUE)
arms <- read.csv(args[1], stringsAsFactors = FALSE)
reference <- args[2]
arms$theta <- arms$mean
arms$v <- arms$sd^2 / arms$n
treatments <- sort(unique(arms$treatment))
others <- setdiff(treatments, reference)

# §2: contrasts of each arm against the study's first arm, with their covariance v_b.
studies <- split(arms, factor(arms$study, levels = unique(arms$study)))
rows <- list()
blocks <- list()
for (s in studies) {
  b <- s[1, ]
  k <- nrow(s) - 1
  rows[[length(rows) + 1]] <- data.frame(study = b$study, design = paste(sort(s$treatment), collapse = ":"),
    base = b$treatment, arm = s$treatment[-1], yi = s$theta[-1] - b$theta, contrast = seq_len(k))
  block <- matrix(b$v, k, k)
  diag(block) <- s$v[-1] + b$v
  blocks[[length(blocks) + 1]] <- block
}
contrasts <- do.call(rbind, rows)
V <- bldiag(blocks)
X <- matrix(0, nrow(contrasts), length(others), dimnames = list(NULL, others))
for (i in seq_len(nrow(contrasts))) {
  if (contrasts$arm[i] != reference) X[i, contrasts$arm[i]] <- 1
  if (contrasts$base[i] != reference) X[i, contrasts$base[i]] <- -1
}

# §3: fixed effect, and random effects with τ² by REML, correlation ½ within a study.
fixed <- rma.mv(contrasts$yi, V, mods = X, intercept = FALSE, method = "FE")
random <- rma.mv(contrasts$yi, V, mods = X, intercept = FALSE, method = "REML",
  random = ~ contrast | study, struct = "CS", rho = 0.5, data = contrasts)
tau2 <- random$tau2

# §4: Q, and Q within designs from a model that gives every design its own contrasts.
# Each design's own parameters: its treatments against the first of them, in a column per design and treatment.
first <- sub(":.*", "", contrasts$design)
columns <- unique(c(paste(contrasts$design, contrasts$arm)[contrasts$arm != first], paste(contrasts$design, contrasts$base)[contrasts$base != first]))
Xd <- matrix(0, nrow(contrasts), length(columns), dimnames = list(NULL, columns))
for (i in seq_len(nrow(contrasts))) {
  if (contrasts$arm[i] != first[i]) Xd[i, paste(contrasts$design[i], contrasts$arm[i])] <- 1
  if (contrasts$base[i] != first[i]) Xd[i, paste(contrasts$design[i], contrasts$base[i])] <- -1
}
within <- rma.mv(contrasts$yi, V, mods = Xd, intercept = FALSE, method = "FE")
Q <- fixed$QE
df <- nrow(contrasts) - length(others)
Qbetween <- Q - within$QE

# §5: network, direct (inverse variance with the network τ²) and indirect estimates per pair.
beta <- c(0, coef(random))
names(beta) <- c(reference, others)
cov <- matrix(0, length(treatments), length(treatments), dimnames = list(names(beta), names(beta)))
cov[others, others] <- vcov(random)
pairs <- combn(treatments, 2)
theta <- setNames(split(arms[, c("study", "theta", "v")], arms$treatment), NULL)
names(theta) <- sort(unique(arms$treatment))
comparisons <- apply(pairs, 2, function(p) {
  a <- p[1]; b <- p[2]
  dN <- beta[a] - beta[b]
  vN <- cov[a, a] + cov[b, b] - 2 * cov[a, b]
  both <- merge(theta[[a]], theta[[b]], by = "study")
  if (nrow(both) == 0) return(c(dN, vN, NA, NA, NA))
  direct <- rma.uni(both$theta.x - both$theta.y, both$v.x + both$v.y + tau2, method = "FE")
  vD <- direct$se^2
  if (1 / vN - 1 / vD <= 1e-10 / vN) return(c(dN, vN, direct$beta, vD, NA))
  vI <- 1 / (1 / vN - 1 / vD)
  dI <- vI * (dN / vN - direct$beta / vD)
  c(dN, vN, direct$beta, vD, (direct$beta - dI) / sqrt(vD + vI))
})

# §6: P-scores (smaller is better here) and SUCRA from 10 000 draws, seed 1.
se <- sqrt(outer(diag(cov), diag(cov), "+") - 2 * cov)
pscore <- sapply(names(beta), function(t) mean(pnorm((beta[-match(t, names(beta))] - beta[t]) / se[t, -match(t, names(beta))])))
set.seed(1)
draws <- matrix(rnorm(10000 * length(others)), 10000) %*% chol(vcov(random))
draws <- sweep(cbind(0, draws), 2, beta, "+")
ranks <- t(apply(draws, 1, rank))
sucra <- colMeans((length(treatments) - ranks) / (length(treatments) - 1))

# §13 (with `all`): importance of study s for a pair = 1 − v_N / v_N without s, τ² held; a pair that
# loses its connection without s (a parameter the refit drops) has importance 1.
importances <- 0
strongest <- c(study = "", value = "")
if (length(args) > 2 && args[3] == "all") {
  variance <- function(cov, a, b) cov[a, a] + cov[b, b] - 2 * cov[a, b]
  full <- apply(pairs, 2, function(p) variance(cov, p[1], p[2]))
  top <- vector("list", ncol(pairs))
  for (s in unique(contrasts$study)) {
    keep <- contrasts$study != s
    refit <- suppressWarnings(rma.mv(contrasts$yi[keep], V[keep, keep], mods = X[keep, , drop = FALSE], intercept = FALSE,
      random = ~ contrast | study, struct = "CS", rho = 0.5, tau2 = tau2, data = contrasts[keep, ]))
    kept <- others[!refit$coef.na]
    without <- matrix(0, length(treatments), length(treatments), dimnames = list(names(beta), names(beta)))
    without[kept, kept] <- vcov(refit)
    lost <- setdiff(others, kept)
    for (k in seq_len(ncol(pairs))) {
      a <- pairs[1, k]; b <- pairs[2, k]
      value <- if (a %in% lost || b %in% lost) 1 else 1 - full[k] / variance(without, a, b)
      if (value >= 0.001) top[[k]] <- head(sort(c(top[[k]], setNames(value, s)), decreasing = TRUE), 10)
    }
  }
  importances <- sum(lengths(top))
  strongest <- c(study = names(top[[1]])[1], value = sprintf("%.10g", top[[1]][1]))
  # Risk-of-bias shares of each direct estimate: the inverse-variance weights (with τ²) by level.
  shares <- apply(pairs, 2, function(p) {
    both <- merge(arms[arms$treatment == p[1], ], arms[arms$treatment == p[2], ], by = "study")
    if (nrow(both) == 0) return(NULL)
    w <- 1 / (both$v.x + both$v.y + tau2)
    tapply(w, both$risk_of_bias.x, sum) / sum(w)
  })
}

cat(sprintf('{"tau2":%.10g,"Q":%.10g,"df":%d,"I2":%.10g,"Qbetween":%.10g,"pairs":%d,"pScoreFirst":%.10g,"sucraFirst":%.10g,"importances":%d,"importanceFirst":["%s",%s]}\n',
  tau2, Q, df, max(0, (Q - df) / Q), Qbetween, ncol(comparisons), pscore[1], sucra[1], importances, strongest["study"], if (strongest["value"] == "") "null" else strongest["value"]))
