using ThermVerify.Design;
using ThermVerify.Quantities;
using ThermVerify.Reporting;
using ThermVerify.Sensors;
using ThermVerify.Simulation;
using ThermVerify.Circuits;
using ThermVerify.Ngspice;

namespace ThermVerify.Cli;

/// <summary>Turns an exception into one clear message on standard error and the documented exit code.</summary>
public static class ErrorReport
{
    public static int Write(Exception exception, TextWriter error)
    {
        var code = ExitCodeFor(exception);
        if (code == ExitCodes.InternalError)
        {
            error.WriteLine($"thermverify: internal error: {exception.GetType().Name}: {exception.Message}");
            error.WriteLine("This is a bug in thermverify; please report it together with the design file that caused it.");
        }
        else
        {
            error.WriteLine($"thermverify: {exception.Message}");
        }
        return code;
    }

    public static int ExitCodeFor(Exception exception) => exception switch
    {
        OperationCanceledException => ExitCodes.BadInput,
        DesignException or UsageException or QuantityFormatException or SensorFitException => ExitCodes.BadInput,
        SensorRangeException or SensorTableException or OutputExistsException => ExitCodes.BadInput,
        FileNotFoundException or DirectoryNotFoundException or UnauthorizedAccessException => ExitCodes.BadInput,
        NgspiceUnavailableException or EngineUnsupportedException => ExitCodes.BadInput,
        NgspiceException => ExitCodes.SimulationFailed,
        SimulationException => ExitCodes.SimulationFailed,
        CircuitException => ExitCodes.SimulationFailed,
        _ => ExitCodes.InternalError,
    };
}
