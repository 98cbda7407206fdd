using LongRecord.Formats;

namespace LongRecord.Cli;

/// <summary>
/// Runs a command's work and turns anticipated failures into one line on stderr and an exit code.
/// Anything unexpected is a fault of LongRecord: printed in full, exit <see cref="ExitCode.Internal"/>.
/// </summary>
public static class CommandRunner
{
    public static int Run(TextWriter stderr, Func<ExitCode> work)
    {
        try
        {
            return (int)work();
        }
        catch (RecordingFormatException e)
        {
            stderr.WriteLine(e.Message);
            return (int)ExitCode.BadInput;
        }
        catch (UserInputException e)
        {
            stderr.WriteLine(e.Message);
            return (int)ExitCode.BadInput;
        }
        catch (OperationCanceledException)
        {
            stderr.WriteLine("cancelled");
            return (int)ExitCode.Cancelled;
        }
        catch (Exception e)
        {
            stderr.WriteLine($"internal error (please report): {e}");
            return (int)ExitCode.Internal;
        }
    }
}
