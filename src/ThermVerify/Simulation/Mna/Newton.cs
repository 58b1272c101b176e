namespace ThermVerify.Simulation.Mna;

/// <summary>Newton–Raphson on a bound system, starting from its present solution.</summary>
internal static class Newton
{
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
        for (var iteration = 0; iteration < settings.MaxIterations; iteration++)
        {
            var next = system.SolveNext();
            if (!AllFinite(next, system.Size, out worstUnknown))
                return false;
            var converged = Converged(system, settings, next, out worstUnknown) && !system.Context.Limited;
            system.AdoptNext();
            if (converged)
                return true;
        }
        return false;
    }

    private static bool Converged(BoundSystem system, NewtonSettings s, double[] next, out int worst)
    {
        var old = system.Context.Solution;
        var isCurrent = system.Layout.IsCurrent;
        worst = -1;
        var worstRatio = 0.0;
        for (var i = 0; i < system.Size; i++)
        {
            var tol = s.RelativeTolerance * Math.Max(Math.Abs(next[i]), Math.Abs(old[i]))
                + (isCurrent[i] ? s.CurrentToleranceAmperes : s.VoltageToleranceVolts);
            var ratio = Math.Abs(next[i] - old[i]) / tol;
            if (ratio > worstRatio)
            {
                worstRatio = ratio;
                worst = i;
            }
        }
        return worstRatio <= 1;
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
