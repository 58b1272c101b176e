using System.Numerics;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>Node phasors at every frequency of an AC analysis, with magnitude/phase helpers.</summary>
internal sealed class AcResult
{
    private readonly MnaLayout layout;
    private readonly Complex[] data;
    private readonly int width;

    internal AcResult(MnaLayout layout, double[] frequencies, Complex[] data, IReadOnlyList<SimulationWarning> warnings)
    {
        this.layout = layout;
        this.data = data;
        width = layout.VectorLength;
        FrequenciesHertz = frequencies;
        Warnings = warnings;
    }

    public IReadOnlyList<double> FrequenciesHertz { get; }

    public IReadOnlyList<SimulationWarning> Warnings { get; }

    public Complex[] Voltage(string node)
    {
        var index = layout.IndexOfNode(node);
        var v = new Complex[FrequenciesHertz.Count];
        for (var k = 0; k < v.Length; k++)
            v[k] = data[k * width + index];
        return v;
    }

    /// <summary>V(output)/V(input) at every frequency.</summary>
    public Complex[] Transfer(string outputNode, string inputNode)
    {
        var o = Voltage(outputNode);
        var i = Voltage(inputNode);
        return [.. o.Zip(i, (a, b) => a / b)];
    }

    /// <summary>|V(output)/V(input)| in dB at every frequency.</summary>
    public double[] MagnitudeDb(string outputNode, string inputNode = "0") =>
        Decibels(inputNode == "0" ? Voltage(outputNode) : Transfer(outputNode, inputNode));

    /// <summary>∠(V(output)/V(input)) in degrees, unwrapped along the sweep.</summary>
    public double[] PhaseDegrees(string outputNode, string inputNode = "0") =>
        PhaseDegrees(inputNode == "0" ? Voltage(outputNode) : Transfer(outputNode, inputNode));

    public static double[] Decibels(IEnumerable<Complex> values) => [.. values.Select(v => 20 * Math.Log10(v.Magnitude))];

    /// <summary>Phase in degrees, unwrapped along the sweep so it is continuous.</summary>
    public static double[] PhaseDegrees(IReadOnlyList<Complex> values)
    {
        var phase = new double[values.Count];
        for (var k = 0; k < phase.Length; k++)
        {
            var p = values[k].Phase * 180 / Math.PI;
            if (k > 0)
                p += 360 * Math.Round((phase[k - 1] - p) / 360);
            phase[k] = p;
        }
        return phase;
    }
}
