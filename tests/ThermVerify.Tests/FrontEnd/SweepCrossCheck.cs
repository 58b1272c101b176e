using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>The DC temperature sweep of a design's circuit in both engines (the built-in one and ngspice), node by node.</summary>
internal static class SweepCrossCheck
{
    /// <summary>Asserts every node at every temperature of the check's grid within 1 µV and gives the largest difference.</summary>
    public static double AssertAgrees(FrontEndDesign design, string[] nodes, string what = "")
    {
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var circuit = FrontEndCircuit.Dc(design, null);
        var ours = ((ICheckEngine)BuiltInEngine.Instance).TemperatureSweep(circuit, temperatures, nodes);
        var theirs = ((ICheckEngine)new NgspiceEngine()).TemperatureSweep(circuit, temperatures, nodes);
        var worst = 0.0;
        for (var n = 0; n < nodes.Length; n++)
            for (var i = 0; i < temperatures.Length; i++)
            {
                worst = Math.Max(worst, Math.Abs(theirs[n][i] - ours[n][i]));
                Tolerance.AssertClose(theirs[n][i], ours[n][i], 0, 1e-6, $"v({nodes[n]}) at {temperatures[i]} °C{(what == "" ? "" : ", " + what)}");
            }
        return worst;
    }
}
