namespace ThermVerify.Design;

/// <summary>Defaults for keys a design file may leave out; docs/design-file.md lists the same values.</summary>
internal static class DesignDefaults
{
    /// <summary>Tolerances and tempcos left out are taken as zero: the nominal design.</summary>
    public const double Tolerance = 0;
    public const double ReferenceCelsius = 25;
    public const double BetaFromCelsius = 25;
    public const double BetaToCelsius = 85;
    public const double StepKelvin = 1;
    public const double SettleLimitLsb = 0.01;
    public const double LeakageDoublingKelvin = 10;
    public const double PinLeakageCelsius = 25;
    public const double MinimumPhaseMarginDegrees = 45;
    /// <summary>A normal tolerance is at 3σ unless the design says otherwise.</summary>
    public const double CoverageFactor = 3;
    /// <summary>Copper's resistance tempco, 0.393 %/K (IEC 60028, annealed copper, at 20 °C; from memory), taken at 25 °C.</summary>
    public const double CopperTempcoPerKelvin = 3.93e-3;
    public const int MinBits = 6;
    public const int MaxBits = 24;
}
