namespace ThermVerify.Simulation.Mna;

/// <summary>
/// A DC solution with the usual fall-backs when plain Newton fails, in SPICE's order (Nagel 1975; Vlach &amp;
/// Singhal, Computer Methods for Circuit Analysis and Design, 1983; both from memory):
/// <list type="number">
/// <item>Newton–Raphson from the present solution, junction voltages limited (pnjlim, in the diode stamp);</item>
/// <item>gmin stepping: a conductance from every node to ground, from 1e-2 S (larger if even that fails) relaxed
/// towards zero; after a success the next reduction grows (up to ×1000), after a failure the last good solution is
/// restored and the reduction shrinks to its square root — the adaptive schedule of SPICE3's dynamic gmin stepping;</item>
/// <item>source stepping: every independent source ramped from 0 to its value, the ramp step doubled after a success
/// and halved after a failure.</item>
/// </list>
/// The last solution must also keep at least half its digits (<see cref="MatrixCondition"/>). When every aid fails
/// after a pivot of some iterate had vanished to rounding, the lost digits are the error reported
/// (<see cref="BoundSystem.LostDigits"/>), rather than a singular matrix: no aid settles an iterate rounding moves at will.
/// </summary>
internal static class DcSolver
{
    private const double FirstGminSiemens = 1e-2;
    private const double LargestGminSiemens = 1e2;
    private const double SmallestGminSiemens = 1e-14;

    /// <returns>The aid that succeeded.</returns>
    public static ConvergenceAid Solve(BoundSystem system, string analysis, double? sweepValue)
    {
        var c = system.Context;
        var guess = (double[])c.Solution.Clone();
        SingularMatrixException? singular = null;
        var where = sweepValue is { } v ? $" at sweep value {v:G6}" : "";
        system.ForgetLostDigits();

        if (Attempt(system, ref singular, out var worst))
            return Checked(system, analysis, where, ConvergenceAid.None);
        if (!system.IsNonlinear && singular is not null)
            throw singular;

        Array.Copy(guess, c.Solution, guess.Length);
        if (GminStepping(system, ref singular, out var w1))
            return Checked(system, analysis, where, ConvergenceAid.GminStepping);
        worst = w1 >= 0 ? w1 : worst;

        Array.Clear(c.Solution);
        if (SourceStepping(system, ref singular, out var w2))
            return Checked(system, analysis, where, ConvergenceAid.SourceStepping);
        worst = w2 >= 0 ? w2 : worst;

        if (system.LostDigits is { } lost)
            throw MatrixCondition.Exception(system.Layout, lost, analysis, where, "did not converge, since an iterate's matrix lost its digits");
        if (singular is not null)
            throw singular;
        var node = worst >= 0 ? system.Layout.UnknownNames[worst] : "(unknown)";
        throw new ConvergenceException(
            $"{analysis}{where} did not converge after Newton, gmin stepping and source stepping; the worst unknown was '{node}'. " +
            "Check for element values that allow no solution (e.g. an op-amp driven outside its rails) or add a DC path.",
            analysis, sweepValue, null, node);
    }

    private static ConvergenceAid Checked(BoundSystem system, string analysis, string where, ConvergenceAid aid)
    {
        system.CheckConditioning(analysis, where);
        return aid;
    }

    /// <summary>Newton from the present solution; a singular matrix on the way counts as a failure (and is remembered).</summary>
    internal static bool Attempt(BoundSystem system, ref SingularMatrixException? singular, out int worst)
    {
        try
        {
            return Newton.Solve(system, NewtonSettings.Default, out worst);
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
        var saved = (double[])c.Solution.Clone();
        try
        {
            // Find a gmin large enough to converge at all.
            var g = FirstGminSiemens;
            while (true)
            {
                c.DiagonalGmin = g;
                if (Attempt(system, ref singular, out worst))
                    break;
                Array.Copy(saved, c.Solution, saved.Length);
                g *= 100;
                if (g > LargestGminSiemens)
                    return false;
            }
            Array.Copy(c.Solution, saved, saved.Length);
            var good = g;
            var factor = 10.0;
            while (good > 0)
            {
                var next = good / factor;
                if (next < SmallestGminSiemens)
                    next = 0;
                c.DiagonalGmin = next;
                if (Attempt(system, ref singular, out worst))
                {
                    good = next;
                    Array.Copy(c.Solution, saved, saved.Length);
                    factor = Math.Min(factor * factor, 1e3);
                    continue;
                }
                Array.Copy(saved, c.Solution, saved.Length);
                factor = Math.Sqrt(factor);
                if (factor < 1.001)
                    return false;
            }
            return true;
        }
        finally
        {
            c.DiagonalGmin = 0;
        }
    }

    private static bool SourceStepping(BoundSystem system, ref SingularMatrixException? singular, out int worst)
    {
        var c = system.Context;
        var saved = new double[c.Solution.Length];
        try
        {
            var factor = 0.0;
            var step = 0.1;
            c.SourceFactor = 0;
            if (!Attempt(system, ref singular, out worst) && !GminStepping(system, ref singular, out worst))
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
                if (step < 1e-7)
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
