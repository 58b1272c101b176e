namespace ThermVerify.Simulation.Mna;

/// <summary>
/// A DC solution with the usual fall-backs when plain Newton fails (Nagel 1975; Vlach & Singhal,
/// Computer Methods for Circuit Analysis and Design, from memory): gmin stepping (a conductance from
/// every node to ground, relaxed decade by decade from 1e-2 S to zero), then source stepping (every
/// independent source ramped from 0 to full value, the step halved on failure).
/// </summary>
internal static class DcSolver
{
    public static void Solve(BoundSystem system, string analysis, double? sweepValue)
    {
        var c = system.Context;
        var guess = (double[])c.Solution.Clone();
        SingularMatrixException? singular = null;
        var worst = -1;

        if (Attempt(system, ref singular, out worst))
            return;
        if (!system.IsNonlinear && singular is not null)
            throw singular;

        Array.Copy(guess, c.Solution, guess.Length);
        if (GminStepping(system, ref singular, out var w1))
            return;
        worst = w1 >= 0 ? w1 : worst;

        Array.Clear(c.Solution);
        if (SourceStepping(system, ref singular, out var w2))
            return;
        worst = w2 >= 0 ? w2 : worst;

        if (singular is not null)
            throw singular;
        var node = worst >= 0 ? system.Layout.UnknownNames[worst] : "(unknown)";
        var where = sweepValue is { } v ? $" at sweep value {v:G6}" : "";
        throw new ConvergenceException(
            $"{analysis}{where} did not converge after Newton, gmin stepping and source stepping; the worst unknown was '{node}'. " +
            "Check for element values that allow no solution (e.g. an op-amp driven outside its rails) or add a DC path.",
            analysis, sweepValue, null, node);
    }

    private static bool Attempt(BoundSystem system, ref SingularMatrixException? singular, out int worst)
    {
        try
        {
            return Newton.Iterate(system, NewtonSettings.Default, out worst);
        }
        catch (SingularMatrixException e)
        {
            singular ??= e;
            worst = -1;
            return false;
        }
    }

    private static bool GminStepping(BoundSystem system, ref SingularMatrixException? singular, out int worst)
    {
        var c = system.Context;
        worst = -1;
        try
        {
            for (var g = 1e-2; g >= 1e-13; g /= 10)
            {
                c.DiagonalGmin = g;
                if (!Attempt(system, ref singular, out worst))
                    return false;
            }
            c.DiagonalGmin = 0;
            return Attempt(system, ref singular, out worst);
        }
        finally
        {
            c.DiagonalGmin = 0;
        }
    }

    private static bool SourceStepping(BoundSystem system, ref SingularMatrixException? singular, out int worst)
    {
        var c = system.Context;
        worst = -1;
        var saved = new double[c.Solution.Length];
        try
        {
            var factor = 0.0;
            var step = 0.1;
            c.SourceFactor = 0;
            if (!Attempt(system, ref singular, out worst))
                return false;
            while (factor < 1)
            {
                var target = Math.Min(1, factor + step);
                Array.Copy(c.Solution, saved, saved.Length);
                c.SourceFactor = target;
                if (Attempt(system, ref singular, out worst))
                {
                    factor = target;
                    step = Math.Min(step * 2, 0.5);
                    continue;
                }
                Array.Copy(saved, c.Solution, saved.Length);
                step /= 2;
                if (step < 1e-6)
                    return false;
            }
            return true;
        }
        finally
        {
            c.SourceFactor = 1;
        }
    }
}
