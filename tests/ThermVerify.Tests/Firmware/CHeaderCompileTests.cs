using System.Globalization;
using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.Firmware;

public class CHeaderCompileTests
{
    // Both directions: an NTC on the low side and an RTD on the high side read falling temperatures with rising codes
    // (negative numerators); an NTC on the high side and an RTD on the low side read rising ones.
    private static readonly string[] Cases =
        ["dense-centi", "sparse-centi", "sparse-deci", "sparse-rtd", "dense-high-side", "sparse-high-side", "sparse-rtd-low-side"];

    private static (FirmwareModel Model, FirmwareTable Table) Make(string name) => name switch
    {
        "dense-centi" => Pair(FirmwareTestModels.NtcLowSide(), m => TableBuilder.EveryCode(m, FixedPointScale.CentiKelvin)),
        "sparse-centi" => Pair(FirmwareTestModels.NtcLowSide(), m => TableBuilder.WithinBound(m, FixedPointScale.CentiKelvin, 0.05)),
        "sparse-deci" => Pair(FirmwareTestModels.NtcLowSide(bits: 16), m => TableBuilder.WithBreakpoints(m, FixedPointScale.DeciKelvin, 24)),
        "sparse-rtd" => Pair(FirmwareTestModels.Pt1000HighSide(), m => TableBuilder.WithinBound(m, FixedPointScale.CentiKelvin, 0.1)),
        "dense-high-side" => Pair(FirmwareTestModels.NtcLowSide(SensorSide.High), m => TableBuilder.EveryCode(m, FixedPointScale.DeciKelvin)),
        "sparse-high-side" => Pair(FirmwareTestModels.NtcLowSide(SensorSide.High), m => TableBuilder.WithinBound(m, FixedPointScale.CentiKelvin, 0.03)),
        _ => Pair(FirmwareTestModels.Pt1000HighSide().WithOtherSide(), m => TableBuilder.WithinBound(m, FixedPointScale.CentiKelvin, 0.1)),
    };

    private static (FirmwareModel, FirmwareTable) Pair(FirmwareModel m, Func<FirmwareModel, FirmwareTable> make) => (m, make(m));

    [GccFact]
    public void Header_compiles_and_C_routine_matches_the_CSharp_port_for_every_code()
    {
        // The C routine and FirmwareTable.Evaluate must return identical integers for every code 0…full scale,
        // including the clamped codes outside the span. C99 (ISO/IEC 9899:1999, 6.5.5) truncates integer division
        // toward zero, as C# does; that is what makes the two agree bit for bit.
        foreach (var name in Cases)
        {
            var (model, table) = Make(name);
            var faults = FaultAnalysis.Thresholds(model, FaultTolerances.None);
            var header = CHeaderRenderer.Render(new FirmwareHeaderContent($"Test front end {name}", "tv_test", model, table,
                TableErrorAnalysis.Evaluate(model, table), faults,
                model.Sensor is ThermVerify.Sensors.BetaThermistor ? ComputedCoefficients.Fit(model) : null), TestRun.Provenance);
            var output = CompileAndRun(header, model.Adc.MaxCode);
            var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            Assert.Equal(model.Adc.MaxCode + 1, lines.Length);
            foreach (var line in lines)
            {
                var parts = line.Split(' ');
                var code = int.Parse(parts[0], CultureInfo.InvariantCulture);
                Assert.True(table.Evaluate(code) == int.Parse(parts[1], CultureInfo.InvariantCulture),
                    $"{name}: code {code}: C gives {parts[1]}, C# gives {table.Evaluate(code)}");
                Assert.True(faults.IsFault(code) == (parts[2] == "1"), $"{name}: code {code}: fault flag differs");
            }
        }
    }

    [GccFact]
    public void A_differential_bridge_header_with_signed_codes_matches_the_CSharp_port_for_every_code()
    {
        // Signed codes −2^15 … 2^15 − 1 (two's complement, the differential input's convention): the C routine takes an
        // int16_t code, negative codes index and interpolate as the C# port does, and the fault flag agrees.
        var model = Verifier.Table(DesignLoader.Load(Path.Combine(Repository.Netlists, "brine-chiller-bridge-differential.toml"))).Model;
        var faults = FaultAnalysis.Thresholds(model, new FaultTolerances(FixedResistorFraction: 0.0005, ExcitationTracksReference: true,
            OppositeHighFraction: 0.0005, OppositeLowFraction: 0.0005));
        foreach (var table in new[] { TableBuilder.EveryCode(model, FixedPointScale.CentiKelvin), TableBuilder.WithinBound(model, FixedPointScale.CentiKelvin, 0.05) })
        {
            var header = CHeaderRenderer.Render(new FirmwareHeaderContent("Test bridge", "tv_test", model, table,
                TableErrorAnalysis.Evaluate(model, table), faults), TestRun.Provenance);
            Assert.Contains("tv_test_temperature(int16_t code)", header);
            var lines = CompileAndRun(header, model.Adc.MaxCode, model.Adc.MinCode).Split('\n', StringSplitOptions.RemoveEmptyEntries);
            Assert.Equal(model.Adc.MaxCode - model.Adc.MinCode + 1, lines.Length);
            foreach (var line in lines)
            {
                var parts = line.Split(' ');
                var code = int.Parse(parts[0], CultureInfo.InvariantCulture);
                Assert.True(table.Evaluate(code) == int.Parse(parts[1], CultureInfo.InvariantCulture),
                    $"code {code}: C gives {parts[1]}, C# gives {table.Evaluate(code)}");
                Assert.True(faults.IsFault(code) == (parts[2] == "1"), $"code {code}: fault flag differs");
            }
        }
    }

    private static string CompileAndRun(string header, int maxCode, int minCode = 0)
    {
        var folder = Directory.CreateTempSubdirectory("thermverify-c-");
        try
        {
            File.WriteAllText(Path.Combine(folder.FullName, "tv_test.h"), header);
            File.WriteAllText(Path.Combine(folder.FullName, "main.c"), $$"""
                #include <stdio.h>
                #include "tv_test.h"
                int main(void)
                {
                    long code;
                    for (code = {{minCode}}L; code <= {{maxCode}}L; code++)
                        printf("%ld %ld %d\n", code, (long)tv_test_temperature(code), tv_test_is_fault(code));
                    return 0;
                }
                """);
            var exe = Path.Combine(folder.FullName, "table");
            ExternalProgram.Run("gcc", ["-std=c99", "-Wall", "-Wextra", "-Werror", "-pedantic", "-O2", "-o", exe, "main.c"], folder.FullName);
            return ExternalProgram.Run(exe, [], folder.FullName);
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}
