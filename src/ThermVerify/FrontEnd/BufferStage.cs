using ThermVerify.Circuits;
using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The op-amp buffer between the divider and the filter: a follower, or a non-inverting stage with a 10 kΩ
/// ground leg, built on the engine's op-amp macro-model, or on the design's own SPICE subcircuit when it names one
/// (only a SPICE engine runs that); an isolation resistor, when given, sits outside the loop.
/// </summary>
internal static class BufferStage
{
    public const string AmplifierOutput = "amp";
    public const string Feedback = "fb";
    internal const double GroundLegOhms = 10e3;

    /// <summary>Adds the buffer driven from <paramref name="input"/>; returns the node that drives the filter.</summary>
    /// <param name="opAmpCelsius">The op-amp's temperature when the design gives no board temperature (its offset drifts to it).</param>
    public static string Add(List<Element> elements, BufferSpec buffer, string input, double? boardCelsius, double? opAmpCelsius)
    {
        var output = buffer.IsolationResistorOhms > 0 ? AmplifierOutput : FrontEndNodes.BufferOutput;
        var inverting = buffer.Topology == BufferTopology.Follower ? output : Feedback;
        elements.Add(buffer.Subcircuit is { } sub
            ? new ExternalOpAmp("Xbuffer", input, inverting, output, sub, buffer.Supply.MinVolts, buffer.Supply.MaxVolts)
            : OpAmpFor(buffer, input, inverting, output, boardCelsius ?? opAmpCelsius));
        if (buffer.Topology == BufferTopology.NonInverting)
        {
            elements.Add(new Resistor("Rgain", output, Feedback, (buffer.Gain - 1) * GroundLegOhms));
            elements.Add(new Resistor("Rground", Feedback, Circuit.Ground, GroundLegOhms));
        }
        if (buffer.IsolationResistorOhms > 0)
            elements.Add(new Resistor("Riso", AmplifierOutput, FrontEndNodes.BufferOutput, buffer.IsolationResistorOhms));
        return FrontEndNodes.BufferOutput;
    }

    /// <summary>
    /// Without a board temperature the op-amp sits at the swept temperature with the rest of the unit, so its offset
    /// drifts with the sweep. A circuit built for one temperature has the offset drifted to it; a temperature sweep
    /// adds the drift by superposition (<see cref="DcLevels"/>), since the macro-model's offset is a constant.
    /// </summary>
    public static bool DriftFollowsSweep(FrontEndDesign design) =>
        design.Check.BoardCelsius is null && design.Buffer is { Subcircuit: null } b && b.OffsetDriftVoltsPerKelvin != 0;

    /// <summary>
    /// The macro-model from the design's datasheet figures. The offset drifts to <paramref name="opAmpCelsius"/> (the
    /// board temperature, or the temperature the circuit is built for; 25 °C when neither is known); the output swings
    /// to within <c>output_swing</c> of each rail.
    /// </summary>
    public static OpAmp OpAmpFor(BufferSpec buffer, string nonInverting, string inverting, string output, double? opAmpCelsius) =>
        new("Xbuffer", nonInverting, inverting, output)
        {
            OpenLoopGain = buffer.DcGainDecibels is { } db ? Math.Pow(10, db / 20) : 1e5,
            GainBandwidthHertz = buffer.GainBandwidthHertz,
            OutputResistanceOhms = buffer.OutputResistanceOhms > 0 ? buffer.OutputResistanceOhms : 1e-3,
            InputOffsetVolts = buffer.OffsetVolts + buffer.OffsetDriftVoltsPerKelvin * ((opAmpCelsius ?? 25) - 25),
            NonInvertingBiasAmperes = buffer.BiasCurrentAmperes + buffer.OffsetCurrentAmperes / 2,
            InvertingBiasAmperes = buffer.BiasCurrentAmperes - buffer.OffsetCurrentAmperes / 2,
            OutputLowVolts = buffer.Supply.MinVolts + buffer.OutputSwingVolts,
            OutputHighVolts = buffer.Supply.MaxVolts - buffer.OutputSwingVolts,
            SlewRateVoltsPerSecond = buffer.SlewRateVoltsPerSecond ?? double.PositiveInfinity,
            CommonModeLowVolts = buffer.InputCommonMode?.MinVolts ?? double.NegativeInfinity,
            CommonModeHighVolts = buffer.InputCommonMode?.MaxVolts ?? double.PositiveInfinity,
            VoltageNoiseVoltsPerRootHertz = buffer.NoiseVoltsPerRootHertz,
            VoltageNoiseCornerHertz = buffer.NoiseCornerHertz ?? 0,
            CurrentNoiseAmperesPerRootHertz = buffer.NoiseAmperesPerRootHertz,
            CurrentNoiseCornerHertz = buffer.NoiseCornerHertz ?? 0,
        };
}
