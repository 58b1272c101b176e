using FsCheck;
using FsCheck.Fluent;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

public class FixedPointInterpolationProperties
{
    [Fact]
    public void Integer_interpolation_rounds_the_exact_quotient_half_away_from_zero()
    {
        // Reference: the exact rational increment (v1 − v0)(code − c0)/(c1 − c0) in decimal (exact for these sizes),
        // rounded half away from zero by System.Decimal and added to v0, as the routine documents — an arithmetic
        // independent of the truncating-division trick. (Rounding the increment, not the sum, differs from rounding
        // the sum when v0 < 0 and the increment ends in exactly .5; see the regression case below.)
        var gen =
            from c0 in Gen.Choose(0, 60_000)
            from width in Gen.Choose(1, 5_000)
            from offset in Gen.Choose(0, 5_000)
            from v0 in Gen.Choose(-30_000, 30_000)
            from dv in Gen.Choose(-30_000, 30_000)
            select (c0, c1: c0 + width, code: c0 + offset % (width + 1), v0, v1: v0 + dv);
        Prop.ForAll(gen.ToArbitrary(), s =>
        {
            var exact = (decimal)(s.v1 - s.v0) * (s.code - s.c0) / (s.c1 - s.c0);
            var expected = s.v0 + (int)Math.Round(exact, MidpointRounding.AwayFromZero);
            var actual = FixedPointInterpolation.Interpolate(s.c0, s.v0, s.c1, s.v1, s.code);
            return (actual == expected).Label($"{s}: got {actual}, exact {exact}");
        }).QuickCheckThrowOnFailure();
    }

    [Fact]
    public void The_increment_is_rounded_not_the_sum()
    {
        // Found by the property above with a reference that rounded the sum: 26955·93/270 = 9284.5 → 9285, so
        // −11777 + 9285 = −2492 (rounding the sum −2492.5 would give −2493).
        Assert.Equal(-2492, FixedPointInterpolation.Interpolate(33724, -11777, 33994, 15178, 33817));
    }

    [Fact]
    public void Halves_round_away_from_zero_both_ways()
    {
        // 0 + 1·1/2 = 0.5 → 1 and 0 − 1·1/2 = −0.5 → −1 (round half away from zero, as documented in the header).
        Assert.Equal(1, FixedPointInterpolation.Interpolate(0, 0, 2, 1, 1));
        Assert.Equal(-1, FixedPointInterpolation.Interpolate(0, 0, 2, -1, 1));
    }
}
