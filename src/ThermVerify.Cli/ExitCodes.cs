namespace ThermVerify.Cli;

/// <summary>The process exit codes, in one place; docs/exit-codes in README.md lists the same.</summary>
public static class ExitCodes
{
    /// <summary>Everything ran and every check is within budget.</summary>
    public const int Success = 0;

    /// <summary>A check or budget failed, or a finding of severity "fail" was raised.</summary>
    public const int CheckFailed = 1;

    /// <summary>Bad input or usage: unreadable design, unknown key, bad value, wrong option.</summary>
    public const int BadInput = 2;

    /// <summary>A simulation could not be completed (non-convergence, singular circuit).</summary>
    public const int SimulationFailed = 3;

    /// <summary>A bug in thermverify: please report it with the design that caused it.</summary>
    public const int InternalError = 4;

    /// <summary>Stopped by Ctrl+C (SIGINT) or SIGTERM before it finished; no output file was written or changed.</summary>
    public const int Cancelled = 130;
}
