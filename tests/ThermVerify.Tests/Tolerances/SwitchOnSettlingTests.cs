using ThermVerify.FrontEnd;
using ThermVerify.Tests.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

public class SwitchOnSettlingTests
{
    /// <summary>
    /// Switching on a 10 kΩ/10 kΩ divider into a 100 nF reservoir: the pin charges as V(1 − e^(−t/τ)) with
    /// τ = (R_s ∥ R_f)·C = 0.5 ms (RC charging, any circuits textbook). The first sample, at the end of the first
    /// acquisition, is short of the settled 1.65 V by 1.65·e^(−t/τ); the 10 pF sampling capacitor, starting empty,
    /// takes a further C_sh/(C_sh + C) of the pin voltage (charge sharing, common practice, no source), which the
    /// 2 µs acquisition then mostly restores; the tolerance covers that 10⁻⁴ share.
    /// </summary>
    [Fact]
    public void FirstSampleAfterSwitchOnFollowsRcCharging()
    {
        var design = TestDesign.Make(("filter.reservoir_capacitor", "\"100 nF\""), ("divider.switch_on_lead", "\"1 ms\""),
            ("divider.reading_interval", "\"1 s\""));
        var sample = SwitchOnSettling.FirstSampleVolts(design, 25, null, 1e-7);
        var t = 1e-3 + 2e-6;
        var expected = 1.65 * (1 - Math.Exp(-t / 0.5e-3));
        Tolerance.AssertClose(expected, sample, 2e-4, what: "first sample");
    }

    /// <summary>A lead of many time constants leaves the first sample at the settled voltage, to within the charge-sharing step.</summary>
    [Fact]
    public void LongLeadSettles()
    {
        var design = TestDesign.Make(("filter.reservoir_capacitor", "\"100 nF\""), ("divider.switch_on_lead", "\"20 ms\""),
            ("divider.reading_interval", "\"1 s\""));
        Tolerance.AssertClose(1.65, SwitchOnSettling.FirstSampleVolts(design, 25, null, 1e-7), 1e-4);
    }
}
