using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>Random resistor ladders against the same network solved by a dense MathNet solve of the nodal equations.</summary>
public class LadderPropertyTests
{
    [Property(MaxTest = 200)]
    public Property Random_ladder_matches_nodal_analysis_solved_by_mathnet(PositiveInt seed, byte stages)
    {
        var n = 1 + stages % 12;
        var random = new Random(seed.Get);
        double Ohms() => Math.Pow(10, 1 + 5 * random.NextDouble());
        var series = Enumerable.Range(0, n).Select(_ => Ohms()).ToArray();
        var shunt = Enumerable.Range(0, n).Select(_ => Ohms()).ToArray();
        var volts = 10 * random.NextDouble() - 5;

        var builder = new CircuitBuilder().VoltageSource("V1", "n0", "0", volts);
        for (var k = 0; k < n; k++)
            builder.Resistor($"Rs{k}", $"n{k}", $"n{k + 1}", series[k]).Resistor($"Rp{k}", $"n{k + 1}", "0", shunt[k]);
        var op = OperatingPoint.Solve(builder.Build());

        // Independent reference: Kirchhoff's current law at nodes 1…n, G·v = i, solved by MathNet.Numerics' LU.
        var g = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(n, n);
        var i = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(n);
        for (var k = 0; k < n; k++)
        {
            g[k, k] += 1 / series[k] + 1 / shunt[k];
            if (k + 1 < n)
            {
                g[k, k] += 1 / series[k + 1];
                g[k, k + 1] -= 1 / series[k + 1];
                g[k + 1, k] -= 1 / series[k + 1];
            }
        }
        i[0] = volts / series[0];
        var v = g.Solve(i);
        return Enumerable.Range(0, n)
            .All(k => Tolerance.Within(op.Voltage($"n{k + 1}"), v[k], 1e-9, 1e-12 * Math.Abs(volts)))
            .Label($"ladder of {n} stages, seed {seed.Get}");
    }
}
