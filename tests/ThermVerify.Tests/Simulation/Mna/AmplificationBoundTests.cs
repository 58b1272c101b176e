using ThermVerify.Circuits;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation.Mna;
using ThermVerify.Tests.Ngspice;
using Xunit.Abstractions;

namespace ThermVerify.Tests.Simulation.Mna;

/// <summary>
/// The one-pass upper bound of the componentwise error amplification (<see cref="DenseLu{T}.ErrorAmplificationBound"/>)
/// that the conditioning check tries before Hager's estimate: never below the exact amplification (n solves with the
/// unit vectors, the reference), and below the limit wherever the exact value is far below it, so that it settles the
/// check there.
/// </summary>
public class AmplificationBoundTests(ITestOutputHelper output)
{
    private static double[] Solved(BoundSystem system)
    {
        Assert.True(Newton.Solve(system, NewtonSettings.Default, out _));
        return system.Context.Solution;
    }

    [Theory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Every_example_s_dc_circuit_is_bounded_from_above_and_settled_by_the_bound(string example)
    {
        var design = ExampleDesigns.Load(example);
        var circuit = FrontEndCircuit.Dc(design, null);
        var worstRatio = 0.0;
        foreach (var celsius in new[] { design.Check.Range.MinCelsius, 25, design.Check.Range.MaxCelsius })
        {
            var system = new BoundSystem(circuit with { TemperatureCelsius = celsius });
            DcSolver.Solve(system, "test", null);
            Solved(system);
            var (bound, exact) = system.AmplificationBoundAndExact();
            Assert.True(bound >= exact, $"{example} at {celsius} °C: bound {bound:G6} below the exact {exact:G6}");
            if (exact < MatrixCondition.Limit / 1e3)
                Assert.True(bound <= MatrixCondition.Limit, $"{example} at {celsius} °C: bound {bound:G3} for an exact {exact:G3}");
            worstRatio = Math.Max(worstRatio, bound / Math.Max(exact, 1e-300));
        }
        output.WriteLine($"{example}: bound within {worstRatio:G3} of the exact amplification");
    }

    /// <summary>Random dense matrices with entries spread over twelve decades, real and complex: never below the exact value.</summary>
    [Fact]
    public void Random_matrices_are_bounded_from_above()
    {
        var random = new Random(17);
        double Entry() => (random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-6, 7));
        for (var trial = 0; trial < 200; trial++)
        {
            var n = random.Next(1, 12);
            var a = new double[n * n];
            for (var i = 0; i < a.Length; i++)
                a[i] = random.NextDouble() < 0.4 ? 0 : Entry();
            for (var i = 0; i < n; i++)
                a[i * n + i] += Entry();
            var lu = new DenseLu<double>(n);
            if (lu.Factor(a) >= 0) continue;
            var x = Enumerable.Range(0, n).Select(_ => Entry()).ToArray();
            var w = Enumerable.Range(0, n).Select(_ => random.NextDouble()).ToArray();
            var exact = lu.ErrorAmplificationPerUnknown(x, w).Max();
            var bound = lu.ErrorAmplificationBound(x, w);
            Assert.True(bound >= exact, $"trial {trial}: bound {bound:G6} below the exact {exact:G6}");

            var c = a.Select((v, i) => new System.Numerics.Complex(v, i % 3 == 0 ? Entry() : 0)).ToArray();
            var complexLu = new DenseLu<System.Numerics.Complex>(n);
            if (complexLu.Factor(c) >= 0) continue;
            var z = x.Select(v => new System.Numerics.Complex(v, -v / 3)).ToArray();
            var complexExact = complexLu.ErrorAmplificationPerUnknown(z, w).Max();
            Assert.True(complexLu.ErrorAmplificationBound(z, w) >= complexExact, $"complex trial {trial}");
        }
    }

    /// <summary>The equilibration's power of two read off the exponent field: the same as ILogB and ScaleB give (.NET's Math), normal, subnormal and extreme magnitudes alike.</summary>
    [Fact]
    public void The_equilibration_scale_is_the_power_of_two_ilogb_and_scaleb_give()
    {
        var random = new Random(3);
        var values = Enumerable.Range(0, 20000).Select(_ => Math.Pow(2, random.NextDouble() * 2140 - 1074) * (1 + random.NextDouble()))
            .Concat([double.Epsilon, 1e-310, double.MaxValue, 1, 0.5, 2, Math.ScaleB(1, 1021), Math.ScaleB(1, 1022), Math.ScaleB(1, -1022)])
            .Where(v => v > 0 && double.IsFinite(v));
        foreach (var m in values)
            Assert.Equal(Math.ScaleB(1.0, -(Math.ILogB(m) + 1)), DenseLu<double>.PowerOfTwoBelowInverse(m));
    }

    /// <summary>The island of ConditioningTests tied by 1e14 Ω: amplification above 1e12, so the bound cannot settle it.</summary>
    [Fact]
    public void An_ill_conditioned_island_is_not_settled_by_the_bound()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 1.0)
            .Resistor("Rtop", "in", "x", 1e14)
            .Resistor("Rlink", "x", "y", 1)
            .Resistor("Rbottom", "y", "0", 1e14)
            .Build();
        var system = new BoundSystem(circuit);
        Solved(system);
        var (bound, exact) = system.AmplificationBoundAndExact();
        Assert.True(exact > 1e12, $"exact {exact:G3}");
        Assert.True(bound >= exact, $"bound {bound:G6} below the exact {exact:G6}");
    }
}
