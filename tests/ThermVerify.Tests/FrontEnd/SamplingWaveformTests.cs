using ThermVerify.FrontEnd;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.FrontEnd;

public class SamplingWaveformTests
{
    [Fact]
    public void Discharged_sampling_capacitor_charges_as_a_single_rc()
    {
        // No pin capacitance and no reservoir: the capacitor C_sh charges from 0 V through the divider's Thevenin
        // resistance plus the switch, v(t) = V_pin·(1 − e^(−t/τ)), τ = (R_th + R_on)·C_sh (RC charging, elementary).
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""));
        const double celsius = 25;
        var waveform = SamplingWaveform.Record(design, celsius, 0.0, settleVolts: 1e-6, BuiltInEngine.Instance, conversions: 2);

        var thevenin = 10e3 * 10e3 / (10e3 + 10e3);   // 10 kΩ NTC at 25 °C against 10 kΩ fixed
        var tau = (thevenin + 1e3) * 10e-12;
        const double pinVolts = 3.3 / 2;
        foreach (var trace in waveform.Conversions)
            for (var i = 0; i < trace.TimeFromStartSeconds.Length; i++)
            {
                var t = trace.TimeFromStartSeconds[i];
                if (t < 0) continue;
                // 1 mV: the switch's finite off resistance and the solver's local error tolerance.
                Tolerance.AssertClose(pinVolts * (1 - Math.Exp(-t / tau)), trace.HoldVolts[i], 0, 1e-3, $"hold at {t:G3} s, conversion {trace.Conversion}");
            }
        Assert.Equal(2, waveform.Conversions.Count);
    }
}
