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
    /// <summary>Written with a sign: taken at that sign; without one the tempco is a bound (<see cref="SignWritten"/>).</summary>
    public bool FixedTempcoSigned { get; init; }
    public required double ExcitationVolts { get; init; }
    public double ExcitationTolerance { get; init; } = DesignDefaults.Tolerance;
    /// <summary>
    /// Null: the divider is excited all the time. A value: the firmware switches the excitation on this long before
    /// the first acquisition window opens, takes one reading and switches it off again.
    /// </summary>
    public double? SwitchOnLeadSeconds { get; init; }
    /// <summary>With a switched excitation: time from one reading to the next (sets the sensor's duty cycle).</summary>
    public double? ReadingIntervalSeconds { get; init; }
}
