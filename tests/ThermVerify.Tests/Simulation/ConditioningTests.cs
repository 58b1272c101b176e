using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>A result that would have lost more than half its digits is refused, with the nodes named.</summary>
public class ConditioningTests
{
    /// <summary>Two nodes joined by 1 Ω, tied to a 1 V source and to ground only through <paramref name="leakOhms"/> each.</summary>
    private static Circuit Island(double leakOhms) => new CircuitBuilder()
        .VoltageSource("V1", "in", "0", 1.0)
        .Resistor("Rtop", "in", "x", leakOhms)
        .Resistor("Rlink", "x", "y", 1)
        .Resistor("Rbottom", "y", "0", leakOhms)
        .Build();

    [Fact]
    public void An_island_tied_by_1e14_ohms_is_refused_naming_its_nodes()
    {
        // The island's common voltage rests on 1e-14 S beside 1 S inside it: rounding the 1 S entries (relative 1e-16)
        // moves it by about 1e-16·1/1e-14 = 1e-2 of a volt, far more than half the digits (componentwise analysis,
        // Skeel 1979, from memory).
        var e = Assert.Throws<IllConditionedMatrixException>(() => OperatingPoint.Solve(Island(1e14)));
        Assert.Equal(["x", "y"], e.Unknowns.Order());
        Assert.Contains("Rlink", e.Elements);
        Assert.True(e.Amplification > 1e12, $"amplification {e.Amplification:G3}");
        Assert.Contains("ill-conditioned", e.Message);
    }

    [Fact]
    public void The_same_island_tied_by_1e6_ohms_is_solved_to_the_digits_its_conditioning_allows()
    {
        // Ohm's law: the divider puts x at (1e6 + 1)/(2e6 + 1) V. The same estimate as above: the 1e-6 S ties sit in
        // diagonal entries of 1 + 1e-6 S, whose rounding (1e-16 S) already moves the island's common voltage by about
        // 1e-16/1e-6 = 1e-10 of it; the amplification (about 1e6) is below the 9.5e7 limit, so it is solved, not refused.
        var op = OperatingPoint.Solve(Island(1e6));
        Tolerance.AssertClose((1e6 + 1) / (2e6 + 1), op.Voltage("x"), 1e-9);
        Tolerance.AssertClose(1e6 / (2e6 + 1), op.Voltage("y"), 1e-9);
    }

    [Fact]
    public void A_transient_that_cannot_step_on_an_ill_conditioned_matrix_says_so()
    {
        // The island again, now with capacitors so the transient has states: its initial point is refused already.
        var circuit = Island(1e14).Add(new Capacitor("Cx", "x", "0", 1e-9));
        Assert.Throws<IllConditionedMatrixException>(() => Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 1e-6 }));
    }
}
