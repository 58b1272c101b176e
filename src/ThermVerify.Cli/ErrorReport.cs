using ThermVerify.Baselines;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Firmware;
using ThermVerify.Ngspice;
using ThermVerify.Quantities;
using ThermVerify.Sensors;
using ThermVerify.Simulation;

namespace ThermVerify.Cli;

/// <summary>Turns an exception into one clear message on standard error and the documented exit code.</summary>
public static class ErrorReport
{
    public static int Write(Exception exception, TextWriter error)
    {
        exception = Unwrap(exception);
        var code = ExitCodeFor(exception);
        if (code == ExitCodes.InternalError)
        {
            error.WriteLine($"thermverify: internal error: {exception.GetType().Name}: {exception.Message}");
            error.WriteLine("This is a bug in thermverify; please report it together with the design file that caused it.");
        }
        else if (code == ExitCodes.Cancelled)
        {
            error.WriteLine("thermverify: cancelled; no output file was written or changed.");
        }
        else
        {
            error.WriteLine($"thermverify: {exception.Message}");
        }
        return code;
    }

    /// <summary>Parallel work reports its failures wrapped; the first inner failure is the one to explain.</summary>
    private static Exception Unwrap(Exception exception) =>
        exception is AggregateException { InnerExceptions.Count: > 0 } aggregate ? Unwrap(aggregate.InnerExceptions[0]) : exception;

    public static int ExitCodeFor(Exception exception) => Unwrap(exception) switch
    {
        OperationCanceledException => ExitCodes.Cancelled,
        FirmwareInputException or TableFormatException => ExitCodes.BadInput,
        DesignException or UsageException or QuantityFormatException or SensorFitException => ExitCodes.BadInput,
        SensorRangeException or SensorTableException or OutputExistsException => ExitCodes.BadInput,
        BaselineException => ExitCodes.BadInput,
        FileNotFoundException or DirectoryNotFoundException or UnauthorizedAccessException => ExitCodes.BadInput,
        NgspiceUnavailableException or EngineUnsupportedException => ExitCodes.BadInput,
        NgspiceException => ExitCodes.SimulationFailed,
        SimulationException => ExitCodes.SimulationFailed,
        CircuitException => ExitCodes.SimulationFailed,
        _ => ExitCodes.InternalError,
    };
}
