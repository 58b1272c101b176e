using FsCheck;
using FsCheck.Fluent;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

public class FixedPointInterpolationProperties
{
    [Fact]
    public void Integer_interpolation_rounds_the_exact_quotient_half_away_from_zero()
    {
        // Reference: the exact rational v0 + (v1 − v0)(code − c0)/(c1 − c0) in decimal (exact for these sizes),
        // rounded half away from zero by System.Decimal — an arithmetic independent of the truncating-division trick.
        var gen =
            from c0 in Gen.Choose(0, 60_000)
            from width in Gen.Choose(1, 5_000)
            from offset in Gen.Choose(0, 5_000)
            from v0 in Gen.Choose(-30_000, 30_000)
            from dv in Gen.Choose(-30_000, 30_000)
            select (c0, c1: c0 + width, code: c0 + offset % (width + 1), v0, v1: v0 + dv);
        Prop.ForAll(gen.ToArbitrary(), s =>
        {
            var exact = s.v0 + (decimal)(s.v1 - s.v0) * (s.code - s.c0) / (s.c1 - s.c0);
            var expected = (int)Math.Round(exact, MidpointRounding.AwayFromZero);
            var actual = FixedPointInterpolation.Interpolate(s.c0, s.v0, s.c1, s.v1, s.code);
            return (actual == expected).Label($"{s}: got {actual}, exact {exact}");
        }).QuickCheckThrowOnFailure();
    }

    [Fact]
    public void Halves_round_away_from_zero_both_ways()
    {
        // 0 + 1·1/2 = 0.5 → 1 and 0 − 1·1/2 = −0.5 → −1 (round half away from zero, as documented in the header).
        Assert.Equal(1, FixedPointInterpolation.Interpolate(0, 0, 2, 1, 1));
        Assert.Equal(-1, FixedPointInterpolation.Interpolate(0, 0, 2, -1, 1));
    }
}
