#!/usr/bin/env python3
"""The peer for `npm run bench`: the same age-structured SEIR model written the way an analyst
would script it, with scipy's solve_ivp (RK45, rtol 1e-6, atol scaled to the population).

Reads one JSON document on stdin (written by bench/bench.ts from the engine's prepared scenario):
  bands, latentStages, infectiousStages, latentPeriodDays, infectiousPeriodDays, horizonDays,
  susceptible0, latent0, infectious0, recovered0 (persons by band), ifr (by band),
  repeats, options: [{name, segments: [{fromDay, toDay, transmission (n x n, row-major)}]}]
and computes, per option, only what such a script computes: the ODE solution at every day, the
attack rate by band and overall, deaths (IFR x infections) and the peak of the infected (E + I)
with its day. Prints one JSON line: per option the median CPU seconds per run (process time,
like the engine's figure in the bench) and the outcomes (for
a sanity check against the engine). No vaccination: the peer models options without a campaign.
"""
import json
import sys
import time

import numpy as np
from scipy.integrate import solve_ivp


def run_option(cfg, option):
    n = cfg["bands"]
    ke, ki = cfg["latentStages"], cfg["infectiousStages"]
    ae = ke / cfg["latentPeriodDays"]
    ai = ki / cfg["infectiousPeriodDays"]
    population = np.array(cfg["population"], dtype=float)
    y = np.zeros((2 + ke + ki) * n)
    y[0:n] = cfg["susceptible0"]
    y[n:2 * n] = cfg["latent0"]
    y[(1 + ke) * n:(2 + ke) * n] += cfg["infectious0"]
    y[(1 + ke + ki) * n:] = cfg["recovered0"]
    atol = 1e-9 * population.sum()
    days = [0.0]
    states = [y[np.newaxis, :].copy()]
    for seg in option["segments"]:
        m = np.array(seg["transmission"], dtype=float).reshape(n, n)

        def rhs(_t, x, m=m):
            s = x[0:n]
            e = x[n:(1 + ke) * n].reshape(ke, n)
            i = x[(1 + ke) * n:(1 + ke + ki) * n].reshape(ki, n)
            lam = m @ np.maximum(i.sum(axis=0), 0.0)
            flow = lam * np.maximum(s, 0.0)
            de = np.empty_like(e)
            de[0] = flow - ae * e[0]
            de[1:] = ae * (e[:-1] - e[1:])
            di = np.empty_like(i)
            di[0] = ae * e[-1] - ai * i[0]
            di[1:] = ai * (i[:-1] - i[1:])
            return np.concatenate([-flow, de.ravel(), di.ravel(), ai * i[-1]])

        t0, t1 = seg["fromDay"], seg["toDay"]
        t_eval = np.arange(int(t0) + 1, int(t1) + 1, dtype=float)
        if t_eval.size == 0 or t_eval[-1] != t1:
            t_eval = np.append(t_eval, t1)
        sol = solve_ivp(rhs, (t0, t1), y, method="RK45", rtol=1e-6, atol=atol, t_eval=t_eval)
        keep = sol.t == np.round(sol.t)
        days.extend(sol.t[keep].tolist())
        states.append(sol.y.T[keep])
        y = sol.y[:, -1]
    traj = np.vstack(states)
    infected = traj[:, n:(1 + ke + ki) * n].reshape(len(days), ke + ki, n).sum(axis=(1, 2))
    seeds = np.array(cfg["latent0"]) + np.array(cfg["infectious0"])
    infections_by_band = np.array(cfg["susceptible0"]) - traj[-1, 0:n] + seeds
    attack_by_band = np.where(population > 0, infections_by_band / np.where(population > 0, population, 1), 0)
    deaths = float((np.array(cfg["ifr"]) * infections_by_band).sum())
    peak = int(np.argmax(infected))
    return {
        "attackRate": float(infections_by_band.sum() / population.sum()),
        "attackRateByBand": attack_by_band.tolist(),
        "deaths": deaths,
        "peakInfectedPersons": float(infected[peak]),
        "peakDay": days[peak],
    }


def main():
    cfg = json.load(sys.stdin)
    out = []
    for option in cfg["options"]:
        run_option(cfg, option)  # warm-up
        times = []
        result = None
        for _ in range(cfg["repeats"]):
            t0 = time.process_time()
            result = run_option(cfg, option)
            times.append(time.process_time() - t0)
        times.sort()
        out.append({"name": option["name"], "secondsPerRun": times[len(times) // 2], **result})
    print(json.dumps({"options": out}))


if __name__ == "__main__":
    main()
