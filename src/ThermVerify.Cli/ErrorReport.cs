using ThermVerify.Api;
using ThermVerify.Ngspice;

namespace ThermVerify.Cli;

/// <summary>Turns an exception into one clear message on standard error and the documented exit code.</summary>
public static class ErrorReport
{
    public static int Write(Exception exception, TextWriter error)
    {
        exception = Failure.Unwrap(exception);
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

    public static int ExitCodeFor(Exception exception) => Failure.Unwrap(exception) switch
    {
        UsageException or NgspiceUnavailableException => ExitCodes.BadInput,
        NgspiceException => ExitCodes.SimulationFailed,
        var other => Failure.KindOf(other) switch
        {
            FailureKind.BadInput => ExitCodes.BadInput,
            FailureKind.SimulationFailed => ExitCodes.SimulationFailed,
            FailureKind.Cancelled => ExitCodes.Cancelled,
            _ => ExitCodes.InternalError,
        },
    };
}
