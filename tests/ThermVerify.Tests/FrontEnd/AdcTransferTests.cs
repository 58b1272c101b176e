using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// The converter's transfer convention and the firmware's inverse against codes worked out by hand. A 3-bit converter
/// with an 8 V reference has Q = 1 V and codes 0…7. With the first transition at ½ LSB (the IEEE Std 1241 ideal
/// converter) the transitions sit at 0.5, 1.5, …, 6.5 V, so code = round(V/Q); with it at 1 LSB (a truncating
/// converter, common practice, no source) they sit at 1, 2, …, 7 V, so code = floor(V/Q). Voltages beyond either end
/// read as the end code.
/// </summary>
public class AdcTransferTests
{
    private static AdcTransfer Adc(FirstTransition first, CodeInverse inverse = CodeInverse.BinMiddle) =>
        new(3, 8.0) { FirstTransition = first, Inverse = inverse };

    [Theory]
    // volts, code at the ½ LSB transition, code at the 1 LSB transition
    [InlineData(-0.3, 0, 0)]      // below zero: clamped to code 0
    [InlineData(0.0, 0, 0)]
    [InlineData(0.49, 0, 0)]
    [InlineData(0.5, 1, 0)]       // the first transition at ½ LSB
    [InlineData(0.99, 1, 0)]
    [InlineData(1.0, 1, 1)]       // the first transition at 1 LSB
    [InlineData(3.49, 3, 3)]
    [InlineData(3.5, 4, 3)]
    [InlineData(6.49, 6, 6)]
    [InlineData(6.5, 7, 6)]       // the last transition at 2^N − 1.5 LSB
    [InlineData(6.99, 7, 6)]
    [InlineData(7.0, 7, 7)]       // the last transition at 2^N − 1 LSB
    [InlineData(7.99, 7, 7)]
    [InlineData(8.0, 7, 7)]       // full scale and above: clamped to code 2^N − 1
    [InlineData(12.0, 7, 7)]
    public void Codes_at_each_convention_match_the_hand_computed_ones(double volts, int half, int one)
    {
        Assert.Equal(half, Adc(FirstTransition.HalfLsb).Code(volts));
        Assert.Equal(one, Adc(FirstTransition.OneLsb).Code(volts));
    }

    [Theory]
    // code, middle and lower edge of the bin at ½ LSB, then at 1 LSB (volts)
    [InlineData(3, 3.0, 2.5, 3.5, 3.0)]
    [InlineData(1, 1.0, 0.5, 1.5, 1.0)]
    [InlineData(6, 6.0, 5.5, 6.5, 6.0)]
    public void Firmware_inverse_reads_the_middle_or_the_edge_of_the_bin(int code, double halfMiddle, double halfEdge, double oneMiddle, double oneEdge)
    {
        Assert.Equal(halfMiddle, Adc(FirstTransition.HalfLsb, CodeInverse.BinMiddle).VoltsOf(code), 12);
        Assert.Equal(halfEdge, Adc(FirstTransition.HalfLsb, CodeInverse.BinEdge).VoltsOf(code), 12);
        Assert.Equal(oneMiddle, Adc(FirstTransition.OneLsb, CodeInverse.BinMiddle).VoltsOf(code), 12);
        Assert.Equal(oneEdge, Adc(FirstTransition.OneLsb, CodeInverse.BinEdge).VoltsOf(code), 12);
        // The bin itself: every voltage inside it gives the code, and the inverse lands inside it.
        foreach (var first in new[] { FirstTransition.HalfLsb, FirstTransition.OneLsb })
        {
            var adc = Adc(first);
            var (low, high) = adc.BinVolts(code);
            Assert.Equal(code, adc.Code(low));
            Assert.Equal(code, adc.Code(high - 1e-9));
            Assert.Equal(code + 1, adc.Code(high));
            Assert.InRange(adc.VoltsOf(code), low, high);
            Assert.Equal(code, adc.CodeReadAs(adc.VoltsOf(code)), 12);
        }
    }

    [Fact]
    public void Reading_a_sample_at_the_bin_middle_errs_by_at_most_half_an_lsb_and_at_the_edge_by_up_to_one()
    {
        // IEEE Std 1241: the ideal quantisation error is uniform on ±Q/2 about the middle of the bin; read at the lower
        // edge, the reading minus the input lies between −Q and 0.
        foreach (var first in new[] { FirstTransition.HalfLsb, FirstTransition.OneLsb })
            for (var v = 0.6; v < 6.4; v += 0.0137)
            {
                var middle = Adc(first, CodeInverse.BinMiddle);
                var edge = Adc(first, CodeInverse.BinEdge);
                Assert.InRange(middle.VoltsOf(middle.Code(v)) - v, -0.5 - 1e-12, 0.5 + 1e-12);
                Assert.InRange(edge.VoltsOf(edge.Code(v)) - v, -1 - 1e-12, 1e-12);
            }
    }

    [Fact]
    public void Default_convention_is_the_ieee_ideal_converter_read_at_the_bin_middle()
    {
        // What docs/methods.md recommends: code = round(V/Q), read back as code·Q.
        var adc = new AdcTransfer(12, 3.3);
        Assert.Equal(FirstTransition.HalfLsb, adc.FirstTransition);
        Assert.Equal(CodeInverse.BinMiddle, adc.Inverse);
        Assert.Equal(1241, adc.Code(1241.5 * 3.3 / 4096 - 1e-9));
        Assert.Equal(1242, adc.Code(1241.5 * 3.3 / 4096 + 1e-9));
        Assert.Equal(1000 * 3.3 / 4096, adc.VoltsOf(1000), 15);
    }
}
