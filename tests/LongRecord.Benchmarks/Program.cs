namespace LongRecord.Benchmarks;

public static class Program
{
    public static int Main(string[] args) => 0;
}
