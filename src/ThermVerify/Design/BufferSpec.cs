namespace ThermVerify.Design;

public enum BufferTopology { Follower, NonInverting }

/// <summary>A closed interval of voltage.</summary>
public readonly record struct VoltageRange(double MinVolts, double MaxVolts);

/// <summary>
/// The user's own op-amp subcircuit: <see cref="File"/> as the design names it, <see cref="FullPath"/> where it really
/// lies (inside the design's folder), <see cref="Name"/> of the .subckt, and <see cref="Netlist"/>, the file as the
/// loader read it strictly and wrote it back element by element (docs/ngspice.md); decks carry that, never the file.
/// </summary>
public sealed record SubcircuitRef(string File, string FullPath, string Name)
{
    /// <summary>The accepted cards of the file (and the files it includes), re-emitted; global names carry a prefix.</summary>
    public string Netlist { get; init; } = "";

    /// <summary>The .subckt's name in <see cref="Netlist"/>.</summary>
    public string SpiceName => Subcircuits.SubcircuitLibrary.GlobalName(Name);
}

/// <summary>
/// An op-amp buffer between the divider and the filter. Error terms default to zero (ideal); properties that are null
/// are not modelled (e.g. no slew-rate limit when <see cref="SlewRateVoltsPerSecond"/> is null).
/// </summary>
public sealed record BufferSpec
{
    public BufferTopology Topology { get; init; } = BufferTopology.Follower;
    /// <summary>Closed-loop gain; 1 for a follower.</summary>
    public double Gain { get; init; } = 1;
    public required double GainBandwidthHertz { get; init; }
    public double? DcGainDecibels { get; init; }
    public double OutputResistanceOhms { get; init; }
    public double OffsetVolts { get; init; }
    public double OffsetDriftVoltsPerKelvin { get; init; }
    /// <summary>Positive flows into the input pin.</summary>
    public double BiasCurrentAmperes { get; init; }
    public double OffsetCurrentAmperes { get; init; }
    /// <summary>Written with a sign: taken at that sign; without one each is a bound (<see cref="SignWritten"/>). The offset current is always as written.</summary>
    public bool OffsetSigned { get; init; }
    public bool OffsetDriftSigned { get; init; }
    public bool BiasCurrentSigned { get; init; }
    public required VoltageRange Supply { get; init; }
    /// <summary>How close the output gets to each rail.</summary>
    public double OutputSwingVolts { get; init; }
    /// <summary>Null: the inputs work rail to rail.</summary>
    public VoltageRange? InputCommonMode { get; init; }
    public double? SlewRateVoltsPerSecond { get; init; }
    public double NoiseVoltsPerRootHertz { get; init; }
    public double NoiseAmperesPerRootHertz { get; init; }
    /// <summary>1/f corner of the voltage noise; null: white noise only.</summary>
    public double? NoiseCornerHertz { get; init; }
    /// <summary>Resistor outside the loop between the output and the filter; 0 = none.</summary>
    public double IsolationResistorOhms { get; init; }
    public double MinimumPhaseMarginDegrees { get; init; } = DesignDefaults.MinimumPhaseMarginDegrees;
    public SubcircuitRef? Subcircuit { get; init; }
}
