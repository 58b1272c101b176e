using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check;

/// <summary>The settling error of a design at one temperature and precharge level, as the check forms it.</summary>
internal static class SettlingError
{
    /// <summary>
    /// The worse of the first sample against the settled (static) pin and the steady sample against the pin with the
    /// average sampling current, in volts (magnitude).
    /// </summary>
    public static double Volts(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts, ICheckEngine? engine = null)
    {
        var outcome = SamplingRun.Run(design, celsius, prechargeVolts, settleVolts, engine: engine);
        var dc = DcLevels.Run(design, [new PrechargeCase("probe", prechargeVolts)], [celsius], engine);
        return Math.Max(Math.Abs(outcome.FirstVolts - dc.StaticSampleLevel(design, 0)), Math.Abs(outcome.SteadyVolts - dc.AverageSampleLevel(design, 0, 0)));
    }
}
