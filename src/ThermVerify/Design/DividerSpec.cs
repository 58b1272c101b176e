namespace ThermVerify.Design;

/// <summary>Which leg of the divider the sensor is: high = between excitation and the ADC node; low = between the node and ground.</summary>
public enum SensorSide { High, Low }

/// <summary>The divider that turns the sensor's resistance into a voltage.</summary>
public sealed record DividerSpec
{
    public required SensorSide SensorSide { get; init; }
    public required double FixedResistorOhms { get; init; }
    /// <summary>Fraction, e.g. 0.001 for 0.1 %.</summary>
    public double FixedTolerance { get; init; } = DesignDefaults.Tolerance;
    /// <summary>Fraction per kelvin, e.g. 25e-6 for 25 ppm/K.</summary>
    public double FixedTempcoPerKelvin { get; init; } = DesignDefaults.Tolerance;
    public required double ExcitationVolts { get; init; }
    public double ExcitationTolerance { get; init; } = DesignDefaults.Tolerance;
}
