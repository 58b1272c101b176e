namespace ThermVerify.Simulation.Mna;

/// <summary>
/// When Newton iterations count as converged: every unknown moved by at most
/// RelativeTolerance·max(|new|, |old|) + (VoltageToleranceVolts or CurrentToleranceAmperes), and no
/// nonlinear element limited its step. The same test as SPICE's (Nagel 1975, from memory), tighter.
/// </summary>
internal readonly record struct NewtonSettings(double RelativeTolerance, double VoltageToleranceVolts,
    double CurrentToleranceAmperes, int MaxIterations)
{
    public static NewtonSettings Default => new(1e-9, 1e-12, 1e-15, 100);
}
