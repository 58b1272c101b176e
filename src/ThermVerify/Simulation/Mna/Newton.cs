namespace ThermVerify.Simulation.Mna;

/// <summary>
/// Newton–Raphson on a bound system, starting from its present solution. An unknown whose iterates keep jittering
/// though nothing is limited may be stuck at the round-off level of an ill-conditioned matrix (a group of nodes tied
/// to ground only through leakage, whose common voltage rounding moves by far more than the tolerance): after three
/// iterations without progress, each unknown's tolerance is widened by its round-off noise, 16·u·(|A⁻¹|·|A|·|x|)_i
/// (the componentwise error bound of the solve, <see cref="DenseLu{T}.ErrorAmplificationPerUnknown"/>), since no
/// iteration can settle it more finely.
/// </summary>
internal static class Newton
{
    private const int StagnantIterations = 3;

    /// <summary>
    /// <see cref="Iterate"/> with the op-amp limiting on (<see cref="Stamps.ClampLimit"/>), and if that fails, once more
    /// from the same start with it off: the limiting cures the rail-to-rail oscillation of an op-amp in negative
    /// feedback, but in a latch (positive feedback) it can keep the iterate from the rail where the solution is, which
    /// plain Newton reaches.
    /// </summary>
    public static bool Solve(BoundSystem system, NewtonSettings settings, out int worstUnknown)
    {
        var c = system.Context;
        if (!system.IsNonlinear)
            return Iterate(system, settings, out worstUnknown);
        var start = (double[])c.Solution.Clone();
        if (Iterate(system, settings, out worstUnknown))
            return true;
        Array.Copy(start, c.Solution, start.Length);
        c.OpAmpLimiting = false;
        try
        {
            return Iterate(system, settings, out worstUnknown);
        }
        finally
        {
            c.OpAmpLimiting = true;
        }
    }

    /// <summary>Iterates to convergence. A linear system takes one solve. Returns false (worst unknown set) on failure.</summary>
    public static bool Iterate(BoundSystem system, NewtonSettings settings, out int worstUnknown)
    {
        worstUnknown = -1;
        if (!system.IsNonlinear)
        {
            var x = system.SolveNext();
            if (!AllFinite(x, system.Size, out worstUnknown))
                return false;
            system.AdoptNext();
            return true;
        }
        double[]? noise = null;
        var previousRatio = double.PositiveInfinity;
        var stagnant = 0;
        for (var iteration = 0; iteration < settings.MaxIterations; iteration++)
        {
            var next = system.SolveNext();
            if (!AllFinite(next, system.Size, out worstUnknown))
                return false;
            var limited = system.Context.Limited;
            if (!limited && system.LinearisationExact(next))
            {
                // The linearised equations were the nonlinear ones between the two iterates: next solves them (an
                // op-amp in its linear region), and a further iteration would only reproduce it.
                system.AdoptNext();
                system.NoteLostDigits();
                return true;
            }
            var ratio = WorstRatio(system, settings, next, noise, out worstUnknown);
            if (!limited && ratio > 1 && noise is null)
            {
                stagnant = ratio > 0.5 * previousRatio ? stagnant + 1 : 0;
                if (stagnant >= StagnantIterations)
                {
                    noise = system.RoundOffNoise(next);
                    ratio = WorstRatio(system, settings, next, noise, out worstUnknown);
                }
            }
            previousRatio = ratio;
            system.AdoptNext();
            system.NoteLostDigits();
            if (ratio <= 1 && !limited)
                return true;
        }
        return false;
    }

    private static double WorstRatio(BoundSystem system, NewtonSettings s, double[] next, double[]? noise, out int worst)
    {
        var old = system.Context.Solution;
        var isCurrent = system.Layout.IsCurrent;
        worst = -1;
        var worstRatio = 0.0;
        for (var i = 0; i < system.Size; i++)
        {
            var tol = s.RelativeTolerance * Math.Max(Math.Abs(next[i]), Math.Abs(old[i]))
                + (isCurrent[i] ? s.CurrentToleranceAmperes : s.VoltageToleranceVolts) + (noise?[i] ?? 0);
            var ratio = Math.Abs(next[i] - old[i]) / tol;
            if (ratio > worstRatio)
            {
                worstRatio = ratio;
                worst = i;
            }
        }
        return worstRatio;
    }

    private static bool AllFinite(double[] x, int n, out int bad)
    {
        for (var i = 0; i < n; i++)
            if (!double.IsFinite(x[i]))
            {
                bad = i;
                return false;
            }
        bad = -1;
        return true;
    }
}
