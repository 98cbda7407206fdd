namespace LongRecord.Cli;

/// <summary>Process exit codes of <c>longrecord</c> (documented in the README).</summary>
public enum ExitCode
{
    /// <summary>Everything asked for was done.</summary>
    Ok = 0,

    /// <summary>The command line could not be understood (unknown option, missing argument).</summary>
    Usage = 1,

    /// <summary>An input could not be read: the one-line error names the file and the problem.</summary>
    BadInput = 2,

    /// <summary>A batch finished, but some recordings failed; each failure is listed.</summary>
    SomeFailed = 3,

    /// <summary>Interrupted (Ctrl+C): 128 + SIGINT, common Unix practice.</summary>
    Cancelled = 130,

    /// <summary>A fault in LongRecord itself (EX_SOFTWARE of sysexits.h, common Unix practice).</summary>
    Internal = 70,
}
