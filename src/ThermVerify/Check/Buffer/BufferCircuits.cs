using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check.Buffer;

/// <summary>
/// The netlists the buffer analyses run on, built from the same front end as `check` so that the op-amp sees its
/// real load: the isolation resistor, the filter, the reservoir and pin capacitance, and, during an acquisition,
/// the sampling switch's on resistance and the sampling capacitor. The acquisition is the heavier load, so it is
/// the one stability and noise are judged on.
/// </summary>
internal static class BufferCircuits
{
    /// <summary>The op-amp's element name in every circuit built from a design.</summary>
    public const string OpAmpName = "Xbuffer";

    /// <summary>The closed sampling switch, as a resistor; its noise is what leaves kT/C on the sampling capacitor.</summary>
    public const string SwitchResistor = Noise.SamplingNoiseCircuit.SwitchResistor;

    public const string SamplingCapacitor = Noise.SamplingNoiseCircuit.SamplingCapacitor;

    /// <summary>Where the step of the second stability view is applied: the buffer's input.</summary>
    public const string StepSource = "Vstep";

    /// <summary>The front end during an acquisition at one temperature (no average sampling current: the switch is closed).</summary>
    public static Circuit Acquiring(FrontEndDesign design, double celsius)
    {
        Require(design);
        return Noise.SamplingNoiseCircuit.Acquiring(design, celsius);
    }

    /// <summary>
    /// The same load with the divider replaced by a step source at the buffer's input, from
    /// <paramref name="fromVolts"/> to <paramref name="toVolts"/> at <paramref name="atSeconds"/>.
    /// </summary>
    public static Circuit Step(FrontEndDesign design, double fromVolts, double toVolts, double atSeconds)
    {
        Require(design);
        var divider = new[] { "Vexc", FrontEndNodes.SensorElement, FrontEndNodes.FixedElement };
        var elements = FrontEndCircuit.Dc(design, null).Elements.Where(e => !divider.Contains(e.Name)).ToList();
        elements.Add(new VoltageSource(StepSource, FrontEndNodes.Divider, Circuit.Ground,
            new PulseWaveform(fromVolts, toVolts, atSeconds, 0, 0, double.MaxValue, 0)));
        Noise.SamplingNoiseCircuit.AddSampling(elements, design);
        return new Circuit(elements);
    }

    /// <summary>The op-amp's own output node: the node the loop is closed from (before any isolation resistor).</summary>
    public static string AmplifierNode(FrontEndDesign design) => FrontEndCircuit.AmplifierNode(design);

    /// <summary>The design with the buffer's figures changed (a candidate op-amp or isolation resistor).</summary>
    public static FrontEndDesign WithBuffer(FrontEndDesign design, Func<BufferSpec, BufferSpec> change) =>
        design with { Buffer = change(Require(design)) };

    internal static BufferSpec Require(FrontEndDesign design) =>
        design.Buffer ?? throw new ArgumentException(
            $"Design '{design.Name}' has no [buffer] section; the buffer analyses need one (add [buffer] with gain_bandwidth and supply).");
}
