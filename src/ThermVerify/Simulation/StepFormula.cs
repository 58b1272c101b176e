using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>The integration formula of one step.</summary>
internal enum StepFormula : byte
{
    BackwardEuler,
    Trapezoidal,
    Gear2,
}

/// <summary>
/// The three formulas as ẋ_n = a0·x_n + a1·x_n−1 + a2·x_n−2 (− ẋ_n−1 for the trapezoidal rule), their local
/// truncation errors and the slope each implies for any unknown. h = t_n − t_n−1, h1 = t_n−1 − t_n−2.
/// <list type="bullet">
/// <item>Backward Euler: a0 = 1/h, a1 = −1/h; error h²/2·x''.</item>
/// <item>Trapezoidal: a0 = 2/h, a1 = −2/h, minus ẋ_n−1; error h³/12·x'''.</item>
/// <item>Gear-2 (BDF2) at variable step, ω = h/h1: a0 = (1 + 2ω)/((1 + ω)·h), a1 = −(1 + ω)/h,
/// a2 = ω²/((1 + ω)·h) — the derivative at t_n of the quadratic through the last three points; its error
/// h²·(h + h1)²/(6·(2h + h1))·x''', which is (2/9)·h³·x''' at constant step (C. W. Gear, Numerical Initial Value
/// Problems in Ordinary Differential Equations, 1971; Hairer &amp; Wanner, Solving ODEs II, §III.5; from memory).</item>
/// </list>
/// </summary>
internal static class StepFormulas
{
    public static int Order(StepFormula f) => f == StepFormula.BackwardEuler ? 1 : 2;

    /// <summary>Sets the context's coefficients for a step of length h after one of length h1.</summary>
    public static void Apply(LoadContext c, StepFormula f, double h, double h1)
    {
        c.Trapezoidal = f == StepFormula.Trapezoidal;
        switch (f)
        {
            case StepFormula.BackwardEuler:
                (c.Ag0, c.Ag1, c.Ag2) = (1 / h, -1 / h, 0);
                break;
            case StepFormula.Trapezoidal:
                (c.Ag0, c.Ag1, c.Ag2) = (2 / h, -2 / h, 0);
                break;
            default:
                var w = h / h1;
                (c.Ag0, c.Ag1, c.Ag2) = ((1 + 2 * w) / ((1 + w) * h), -(1 + w) / h, w * w / ((1 + w) * h));
                break;
        }
    }

    /// <summary>
    /// The factor that turns the divided difference x[t_n, …] of order k + 1 (three points for backward Euler,
    /// four for the order-2 formulas) into the local truncation error: x'' = 2·x[3 points], x''' = 6·x[4 points].
    /// </summary>
    public static double ErrorFactor(StepFormula f, double h, double h1) => f switch
    {
        StepFormula.BackwardEuler => h * h,
        StepFormula.Trapezoidal => h * h * h / 2,
        _ => h * h * (h + h1) * (h + h1) / (2 * h + h1),
    };

    /// <summary>The time derivative the formula assigns to an unknown at the new point.</summary>
    public static double Slope(StepFormula f, double x, double x1, double x2, double slope1, double h, double h1) => f switch
    {
        StepFormula.BackwardEuler => (x - x1) / h,
        StepFormula.Trapezoidal => 2 * (x - x1) / h - slope1,
        _ => GearSlope(x, x1, x2, h, h1),
    };

    private static double GearSlope(double x, double x1, double x2, double h, double h1)
    {
        var w = h / h1;
        return ((1 + 2 * w) * x - (1 + w) * (1 + w) * x1 + w * w * x2) / ((1 + w) * h);
    }
}
