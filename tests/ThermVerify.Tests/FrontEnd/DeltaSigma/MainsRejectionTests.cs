using System.Numerics;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Tests.Design;

namespace ThermVerify.Tests.FrontEnd.DeltaSigma;

/// <summary>Rejection of interference at the listed frequencies: the digital filter's closed form and the analog divider's.</summary>
public class MainsRejectionTests
{
    [Theory]
    [InlineData("10 Hz", 3)]
    [InlineData("50 Hz", 3)]
    [InlineData("40 Hz", 1)]
    public void The_digital_part_is_the_sinc_closed_form_and_the_analog_part_the_loaded_RC_divider(string rate, int order)
    {
        var design = DeltaSigmaDesigns.Make(("adc.data_rate", $"\"{rate}\""), ("adc.filter", $"\"sinc{order}\""),
            ("adc.rejection_frequencies", "[\"50 Hz\", \"60 Hz\", \"400 Hz\"]"), ("adc.interference", "\"10 mV\""),
            ("filter.series_resistor", "\"1 kohm\""), ("filter.reservoir_capacitor", "\"1 uF\""));
        var d = design.Adc.DeltaSigma!;
        var rows = MainsRejection.At(design, 25);
        var point = new ClosedFormModel(design).At(25);
        var (rs, rf, req) = (point.SensorOhms, 10e3, 1 / (256e3 * 8e-12));
        foreach (var row in rows)
        {
            // |sin(πfM/f_mod)/(M sin(πf/f_mod))|^N (Hogenauer 1981, from memory).
            var x = Math.PI * row.Hertz / d.ModulatorRateHertz;
            var m = d.Decimation;
            var digital = Math.Pow(Math.Abs(Math.Sin(m * x) / (m * Math.Sin(x))), order);
            Assert.True(Tolerance.Within(row.DigitalGain, digital, 1e-6, 1e-12), $"{row.Hertz} Hz: {row.DigitalGain} against {digital}");
            // A source in series with the low-side sensor: Thévenin V·R_f/(R_s + R_f) behind R_s ∥ R_f + 1 kΩ, into
            // R_eq ∥ 1/(jωC) (superposition and Thévenin's theorem, elementary).
            var z = 1 / (1 / new Complex(req, 0) + new Complex(0, 2 * Math.PI * row.Hertz * 1e-6));
            var analog = (rf / (rs + rf) * z / (rs * rf / (rs + rf) + 1e3 + z)).Magnitude;
            Assert.True(Tolerance.Within(row.AnalogGain, analog, 1e-9, 0), $"{row.Hertz} Hz analog: {row.AnalogGain} against {analog}");
            Tolerance.AssertClose(0.01 * analog * digital, row.ErrorVolts!.Value, 1e-9, 1e-15, "error in volts");
            Tolerance.AssertClose(row.ErrorVolts!.Value / Math.Abs(point.VoltsPerKelvin), row.ErrorKelvin!.Value, 1e-12, 1e-18, "error in K");
        }
        // A sinc filter at 10 Hz nulls both mains frequencies (multiples of its data rate); at 50 Hz only 50 Hz.
        if (rate == "10 Hz") Assert.All(rows.Take(2), r => Assert.True(r.DigitalGain < 1e-9));
        if (rate == "50 Hz") Assert.True(rows[0].DigitalGain < 1e-9 && rows[1].DigitalGain > 1e-3);
    }
}
