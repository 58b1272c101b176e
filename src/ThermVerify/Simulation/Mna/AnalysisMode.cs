namespace ThermVerify.Simulation.Mna;

internal enum AnalysisMode
{
    /// <summary>Operating point or DC sweep: capacitors open, inductors short.</summary>
    Dc,

    /// <summary>A time step with companion models of the integration method.</summary>
    Transient,
}
